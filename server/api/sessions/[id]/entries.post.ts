import { and, eq, sql } from 'drizzle-orm'
import type { Database } from '../../../db/client'
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
  // The keys stored when the session started; only sessions started before they were stored plan again.
  const segments = session.segmentKeys ?? await plannedSegmentKeys(db, caller.teamId, session.assignmentId)
  const key = segmentKey(body)
  const segment = segments.find(item => item.key === key)

  if (segment && Date.now() <= editableUntil(session).getTime()) {
    // One statement: the entry with its exercise link, which stays empty when the library has since
    // deleted the exercise the snapshot names. A repeated idempotency key inserts nothing. The commit is
    // shared with other athletes' entries arriving at the same moment (server/utils/entry-writes.ts).
    const inserted = await insertEntry({
      teamId: caller.teamId,
      sessionId: session.id,
      athleteId: caller.userId,
      idempotencyKey: body.idempotencyKey,
      stepId: body.stepId,
      exerciseId: segment.exerciseId
        ? sql`(SELECT ${exercises.id} FROM ${exercises} WHERE ${exercises.id} = ${segment.exerciseId} AND ${exercises.teamId} = ${caller.teamId})`
        : null,
      set: body.set ?? null,
      round: body.round ?? null,
      reps: body.reps ?? null,
      kg: body.kg ?? null,
      seconds: body.seconds ?? null,
      meters: body.meters ?? null,
      rpe: body.rpe ?? null,
    })
    if (inserted) {
      await refreshFinishedStatus(db, caller.teamId, session)
      setResponseStatus(event, 201)
      return entryView(inserted)
    }
  }

  // A repeated key (a retry, or another request with it won the race) answers the first result, unchanged.
  const [earlier] = await db.select().from(entryLogs)
    .where(and(eq(entryLogs.sessionId, session.id), eq(entryLogs.idempotencyKey, body.idempotencyKey))).limit(1)
  if (earlier) {
    setResponseStatus(event, 200)
    return entryView(earlier)
  }
  assertEditable(session)
  if (!segment) refuseField('stepId', 'This routine has no such set or interval to log')
  notFound('No such entry')
})

/** The loggable keys planned from the assignment's snapshot (sessions started before keys were stored). */
async function plannedSegmentKeys(db: Database, teamId: number, assignmentId: number) {
  const [assignment] = await db.select({ snapshot: assignments.snapshot }).from(assignments)
    .where(and(eq(assignments.id, assignmentId), eq(assignments.teamId, teamId))).limit(1)
  if (!assignment) notFound('No such session')
  return segmentKeysOf(assignment.snapshot)
}
