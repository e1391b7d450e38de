import { and, eq, isNotNull, isNull, ne } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { finishSessionSchema, MAX_SECONDS, PAIN_FLAG_THRESHOLD } from '#shared/schemas/session'
import { sessionLoad } from '#shared/utils/load'
import { assignments, entryLogs, injuryNotes, painFlags, sessionLogs } from '../../../db/schema'

/** Ends a session: effort, pain and note; stores the session load, flags pain, marks the assignment. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, finishSessionSchema)
  const db = await useDb()
  const session = await findOwnSession(db, caller, id)
  if (session.finishedAt) {
    const flags = await db.select().from(painFlags).where(eq(painFlags.sessionId, session.id))
    return { session: sessionView(session), flags, status: null }
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
  // One flag per session: high pain outranks a new area (the area is kept on the flag either way).
  const reason = pain >= PAIN_FLAG_THRESHOLD ? 'high_pain' : painArea && !known.has(painArea) ? 'new_area' : null

  const result = await db.transaction(async (tx) => {
    const [updated] = await tx.update(sessionLogs).set({
      finishedAt,
      durationS,
      sessionRpe: body.sessionRpe,
      load,
      pain,
      painArea,
      note: body.note ?? '',
    }).where(and(eq(sessionLogs.id, session.id), eq(sessionLogs.teamId, caller.teamId), isNull(sessionLogs.finishedAt))).returning()
    // A second finish racing this one already won: change nothing more.
    if (!updated) return null
    await tx.update(assignments).set({ status }).where(and(eq(assignments.id, assignment.id), eq(assignments.teamId, caller.teamId)))
    const flags = reason
      ? await tx.insert(painFlags).values({ teamId: caller.teamId, athleteId: caller.userId, sessionId: session.id, pain, area: painArea, reason }).returning()
      : []
    return { session: sessionView(updated), flags, status }
  })
  if (result) return result
  const [finished] = await db.select().from(sessionLogs).where(eq(sessionLogs.id, session.id)).limit(1)
  return { session: sessionView(finished!), flags: await db.select().from(painFlags).where(eq(painFlags.sessionId, session.id)), status: null }
})
