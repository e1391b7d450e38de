import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { startSessionSchema } from '#shared/schemas/session'
import { todayIn } from '#shared/utils/dates'
import { sessionLogs } from '../../../db/schema'

const EARLIEST_START_MS = 7 * 86_400_000
const CLOCK_SKEW_MS = 5 * 60_000

/** Starts a session of the caller's assignment; the same clientId always answers the same session. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, startSessionSchema)
  const db = await useDb()
  const assignment = await findOwnAssignment(db, caller, id)
  const now = Date.now()
  if (body.startedAt && (body.startedAt > now + CLOCK_SKEW_MS || body.startedAt < now - EARLIEST_START_MS)) {
    refuseField('startedAt', 'A session starts within the last 7 days')
  }
  const startedAt = new Date(Math.min(body.startedAt ?? now, now))
  const inserted = await db.insert(sessionLogs).values({
    teamId: caller.teamId,
    assignmentId: assignment.id,
    athleteId: caller.userId,
    clientId: body.clientId,
    startedAt,
    day: todayIn(caller.timezone, startedAt),
    segmentKeys: segmentKeysOf(assignment.snapshot),
  }).onConflictDoNothing().returning()
  const [session] = inserted.length
    ? inserted
    : await db.select().from(sessionLogs)
        .where(and(eq(sessionLogs.athleteId, caller.userId), eq(sessionLogs.clientId, body.clientId))).limit(1)
  if (!session) notFound('No such session')
  if (session.assignmentId !== assignment.id) {
    refuse(409, 'This clientId already belongs to another session', { clientId: 'This clientId already belongs to another session' })
  }
  setResponseStatus(event, inserted.length ? 201 : 200)
  return sessionView(session)
})
