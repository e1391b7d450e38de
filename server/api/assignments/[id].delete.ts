import { and, eq } from 'drizzle-orm'
import { assignments, sessionLogs } from '../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'

/** Removes one assignment (and e-mails the athlete a notice); one with a logged session stays, because the log belongs to it. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const [assignment] = await db.select({ id: assignments.id, athleteId: assignments.athleteId, date: assignments.date, snapshot: assignments.snapshot }).from(assignments).where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId))).limit(1)
  if (!assignment) notFound('No such assignment')
  const [log] = await db.select({ id: sessionLogs.id }).from(sessionLogs).where(eq(sessionLogs.assignmentId, id)).limit(1)
  if (log) refuse(409, 'This session has been logged; it stays in the athlete\'s record')
  const [athlete] = await athletesById(db, caller.teamId, [assignment.athleteId])
  await db.transaction(async (tx) => {
    await tx.delete(assignments).where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId)))
    if (athlete) await queuePlanChange(tx, { teamId: caller.teamId, teamName: caller.teamName, athlete, change: { kind: 'removed', title: assignment.snapshot.title, from: assignment.date } })
  })
  setResponseStatus(event, 204)
  return null
})
