import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { removeMemberQuerySchema } from '#shared/schemas/team'
import { memberships } from '../../../db/schema'

/**
 * Removes a member from the team. Coaches remove athletes; only the head coach removes coaches.
 * An athlete's history stays with the team (anonymised when asked).
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { anonymise } = queryWith(event, removeMemberQuerySchema)
  const db = await useDb()
  const [member] = await db.select({ role: memberships.role }).from(memberships)
    .where(and(eq(memberships.teamId, caller.teamId), eq(memberships.userId, id))).limit(1)
  if (!member) notFound('No such member')
  if (member.role !== 'athlete' && caller.role !== 'head_coach') {
    refuse(403, 'Only the head coach can do this')
  }
  if (id === caller.userId) {
    refuseField('id', 'To leave the team, use "Leave this team"')
  }
  if (member.role === 'head_coach' && await headCoachCount(db, caller.teamId, id) === 0) {
    refuse(409, 'The team needs a head coach')
  }
  await endMembership(db, caller.teamId, id, { anonymise })
  setResponseStatus(event, 204)
  return null
})
