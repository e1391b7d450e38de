import { and, desc, eq, inArray, isNotNull } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { planSession } from '#shared/utils/session-plan'
import { isUnder18 } from '#shared/utils/age'
import { exercises, sessionLogs, teams } from '../../../db/schema'

/** The assigned athlete's own session plan: segments with their paces and loads, and the cautions. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const assignment = await findOwnAssignment(db, caller, id)
  const context = await loadAthleteContext(db, caller.teamId, caller.userId)
  if (!context) notFound('No such assignment')
  const plan = planSession(assignment.snapshot, {
    paces: context.paces,
    estimatedMaxKg: context.estimatedMaxKg,
    injuryNotes: context.injuryNotes,
  })
  const sessions = await db.select().from(sessionLogs)
    .where(and(eq(sessionLogs.assignmentId, assignment.id), eq(sessionLogs.athleteId, caller.userId)))
    .orderBy(desc(sessionLogs.startedAt))
  const [team] = await db.select({ emergencyNumber: teams.emergencyNumber }).from(teams).where(eq(teams.id, caller.teamId)).limit(1)
  const exerciseIds = assignment.snapshot.exercises.map(exercise => exercise.id)
  const withClips = exerciseIds.length
    ? await db.select({ id: exercises.id }).from(exercises)
        .where(and(eq(exercises.teamId, caller.teamId), inArray(exercises.id, exerciseIds), isNotNull(exercises.clipId)))
    : []
  return {
    /** Exercises whose demo clip can be played now (the library's clip may have changed since the snapshot). */
    clipExerciseIds: withClips.map(row => row.id),
    assignment: { id: assignment.id, date: assignment.date, note: assignment.note, status: assignment.status, routineId: assignment.routineId, block: assignment.snapshot.block ?? null },
    athlete: {
      name: context.athlete.name,
      units: context.profile?.units ?? 'km',
      hasBenchmark: Boolean(context.paces),
      under18: isUnder18(context.profile?.birthYear),
      activeInjuries: context.injuryNotes.filter(note => note.status === 'active').map(note => ({ id: note.id, bodyArea: note.bodyArea, note: note.note })),
    },
    team: { emergencyNumber: team?.emergencyNumber ?? null },
    plan,
    sessions: sessions.map(sessionView),
  }
})
