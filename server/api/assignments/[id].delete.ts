import { and, eq } from 'drizzle-orm'
import { assignments, sessionLogs } from '../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'

/** Removes one assignment; one with a logged session stays, because the log belongs to it. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const [assignment] = await db.select({ id: assignments.id }).from(assignments).where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId))).limit(1)
  if (!assignment) notFound('No such assignment')
  const [log] = await db.select({ id: sessionLogs.id }).from(sessionLogs).where(eq(sessionLogs.assignmentId, id)).limit(1)
  if (log) refuse(409, 'This session has been logged; it stays in the athlete\'s record')
  await db.delete(assignments).where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId)))
  setResponseStatus(event, 204)
  return null
})
