import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { previewQuerySchema } from '#shared/schemas/routine'
import { generalCautions, matchCautions } from '#shared/utils/cautions'
import { buildTimeline } from '#shared/utils/timeline'
import type { RoutinePreview } from '#shared/types/routine'
import { memberships } from '../../../db/schema'

/** The routine as one athlete would get it: their paces and loads filled in, their cautions first. */
export default defineEventHandler(async (event): Promise<RoutinePreview> => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { athleteId } = queryWith(event, previewQuerySchema)
  const db = await useDb()
  const routine = await findTeamRoutine(db, caller.teamId, id)
  const [member] = await db.select({ userId: memberships.userId }).from(memberships)
    .where(and(eq(memberships.teamId, caller.teamId), eq(memberships.userId, athleteId), eq(memberships.role, 'athlete'))).limit(1)
  const context = member ? await loadAthleteContext(db, caller.teamId, athleteId) : null
  if (!context) notFound('No such athlete in your team')

  const exercises = await routineExerciseDetails(db, caller.teamId, routine.steps)
  const timeline = buildTimeline(routine.steps, context.paces ? { paces: context.paces } : {})
  const activeNotes = context.injuryNotes.filter(note => note.status === 'active')
  return {
    routine: { id: routine.id, title: routine.title, category: routine.category, version: routine.version, steps: routine.steps },
    athlete: {
      id: context.athlete.id,
      name: context.athlete.name,
      units: context.profile?.units ?? 'km',
      benchmark: context.profile?.benchmarkDistanceM && context.profile.benchmarkTimeS
        ? { distanceM: context.profile.benchmarkDistanceM, timeS: context.profile.benchmarkTimeS, date: context.profile.benchmarkDate }
        : null,
    },
    paces: context.paces,
    targets: resolveRoutineTargets(routine.steps, context),
    timeline,
    exercises: exercises.map(exercise => ({ id: exercise.id, name: exercise.name, category: exercise.category })),
    injuryNotes: activeNotes.map(note => ({ bodyArea: note.bodyArea, note: note.note, since: note.since })),
    cautions: matchCautions(exercises, activeNotes, routine.steps),
    generalCautions: generalCautions([routine.category, ...exercises.map(exercise => exercise.category)]),
  }
})
