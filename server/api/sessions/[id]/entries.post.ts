import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { entrySchema } from '#shared/schemas/session'
import { assignments, entryLogs, exercises } from '../../../db/schema'

/**
 * Logs one set or interval. A repeated idempotency key answers 200 with the first result, unchanged.
 * A finished session still takes entries within the edit window (late offline sends), and its
 * assignment's status is worked out again; after the window, 409.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, entrySchema)
  const db = await useDb()
  const session = await findOwnSession(db, caller, id)

  const [earlier] = await db.select().from(entryLogs)
    .where(and(eq(entryLogs.sessionId, session.id), eq(entryLogs.idempotencyKey, body.idempotencyKey))).limit(1)
  if (earlier) {
    setResponseStatus(event, 200)
    return entryView(earlier)
  }
  assertEditable(session)

  const [assignment] = await db.select({ snapshot: assignments.snapshot }).from(assignments)
    .where(and(eq(assignments.id, session.assignmentId), eq(assignments.teamId, caller.teamId))).limit(1)
  if (!assignment) notFound('No such session')
  const segment = loggableKeys(assignment.snapshot).find(item => item.key === segmentKey(body))
  if (!segment) {
    refuseField('stepId', 'This routine has no such set or interval to log')
  }

  // The snapshot may name an exercise the library has since deleted; the entry then keeps no link.
  const [exercise] = segment.exerciseId
    ? await db.select({ id: exercises.id }).from(exercises).where(and(eq(exercises.id, segment.exerciseId), eq(exercises.teamId, caller.teamId))).limit(1)
    : []

  const inserted = await db.insert(entryLogs).values({
    teamId: caller.teamId,
    sessionId: session.id,
    athleteId: caller.userId,
    idempotencyKey: body.idempotencyKey,
    stepId: body.stepId,
    exerciseId: exercise?.id ?? null,
    set: body.set ?? null,
    round: body.round ?? null,
    reps: body.reps ?? null,
    kg: body.kg ?? null,
    seconds: body.seconds ?? null,
    meters: body.meters ?? null,
    rpe: body.rpe ?? null,
  }).onConflictDoNothing().returning()
  if (inserted[0]) {
    await refreshFinishedStatus(db, caller.teamId, session)
    setResponseStatus(event, 201)
    return entryView(inserted[0])
  }
  // Another request with the same key won the race: answer its result.
  const [first] = await db.select().from(entryLogs)
    .where(and(eq(entryLogs.sessionId, session.id), eq(entryLogs.idempotencyKey, body.idempotencyKey))).limit(1)
  if (!first) notFound('No such entry')
  setResponseStatus(event, 200)
  return entryView(first)
})
