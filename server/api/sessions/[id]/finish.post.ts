import { and, eq, isNotNull, isNull, ne } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { finishSessionSchema, MAX_SECONDS, PAIN_FLAG_THRESHOLD } from '#shared/schemas/session'
import { sessionLoad } from '#shared/utils/load'
import { needsUrgentGuidance, urgentGuidance } from '#shared/utils/urgent-guidance'
import { assignments, entryLogs, injuryNotes, painFlags, sessionLogs, teams } from '../../../db/schema'

/** Ends a session: effort, pain and note; stores the session load, flags pain, marks the assignment. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, finishSessionSchema)
  const db = await useDb()
  const session = await findOwnSession(db, caller, id)
  const [team] = await db.select({ emergencyNumber: teams.emergencyNumber }).from(teams).where(eq(teams.id, caller.teamId)).limit(1)
  // Severe or sudden pain: the answer carries the guidance so the player shows it before anything else.
  const urgency = (pain: number | null, sudden: boolean) => {
    const urgent = needsUrgentGuidance({ pain, sudden })
    return { urgent, guidance: urgent ? urgentGuidance(team?.emergencyNumber) : null }
  }
  if (session.finishedAt) {
    const flags = await db.select().from(painFlags).where(eq(painFlags.sessionId, session.id))
    return { session: sessionView(session), flags, status: null, ...urgency(session.pain, session.painSudden) }
  }

  const [assignment] = await db.select().from(assignments)
    .where(and(eq(assignments.id, session.assignmentId), eq(assignments.teamId, caller.teamId))).limit(1)
  if (!assignment) notFound('No such session')

  const finishedAt = new Date()
  const wallSeconds = Math.min(MAX_SECONDS, Math.max(0, (finishedAt.getTime() - session.startedAt.getTime()) / 1000))
  const durationS = Math.round(body.durationS ?? wallSeconds)
  const load = sessionLoad(body.sessionRpe, durationS / 60)
  const pain = body.pain ?? 0
  const painArea = pain > 0 ? (body.painArea ?? null) : null
  const sudden = pain > 0 && Boolean(body.sudden)

  const [entries, notes, earlierPain] = await Promise.all([
    db.select({ stepId: entryLogs.stepId, set: entryLogs.set, round: entryLogs.round }).from(entryLogs).where(eq(entryLogs.sessionId, session.id)),
    db.select({ bodyArea: injuryNotes.bodyArea }).from(injuryNotes).where(and(eq(injuryNotes.athleteId, caller.userId), eq(injuryNotes.teamId, caller.teamId))),
    db.select({ area: sessionLogs.painArea }).from(sessionLogs)
      .where(and(eq(sessionLogs.athleteId, caller.userId), eq(sessionLogs.teamId, caller.teamId), ne(sessionLogs.id, session.id), isNotNull(sessionLogs.painArea))),
  ])
  const logged = new Set(entries.map(entry => segmentKey(entry)))
  const expected = loggableKeys(assignment.snapshot)
  const status = expected.every(segment => logged.has(segment.key)) ? 'done' : 'partial'

  const known = new Set([...notes.map(note => note.bodyArea), ...earlierPain.map(row => row.area)])
  // One flag per session: high pain outranks sudden pain, which outranks a new area (the area is kept either way).
  const reason = pain >= PAIN_FLAG_THRESHOLD ? 'high_pain' : sudden ? 'sudden' : painArea && !known.has(painArea) ? 'new_area' : null

  const result = await db.transaction(async (tx) => {
    const [updated] = await tx.update(sessionLogs).set({
      finishedAt,
      durationS,
      sessionRpe: body.sessionRpe,
      load,
      pain,
      painArea,
      painSudden: sudden,
      note: body.note ?? '',
    }).where(and(eq(sessionLogs.id, session.id), eq(sessionLogs.teamId, caller.teamId), isNull(sessionLogs.finishedAt))).returning()
    // A second finish racing this one already won: change nothing more.
    if (!updated) return null
    await tx.update(assignments).set({ status }).where(and(eq(assignments.id, assignment.id), eq(assignments.teamId, caller.teamId)))
    const flags = reason
      ? await tx.insert(painFlags).values({ teamId: caller.teamId, athleteId: caller.userId, sessionId: session.id, pain, area: painArea, reason, sudden }).returning()
      : []
    // Queued in the same transaction: a flag and its e-mails to the coaches exist together or not at all.
    for (const flag of flags) await notifyCoachesOfPainFlag(tx, caller, flag, assignment.snapshot.title)
    return { session: sessionView(updated), flags, status }
  })
  if (result) return { ...result, ...urgency(pain, sudden) }
  const [finished] = await db.select().from(sessionLogs).where(eq(sessionLogs.id, session.id)).limit(1)
  return { session: sessionView(finished!), flags: await db.select().from(painFlags).where(eq(painFlags.sessionId, session.id)), status: null, ...urgency(finished!.pain, finished!.painSudden) }
})
