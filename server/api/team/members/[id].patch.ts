import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { memberRoleSchema } from '#shared/schemas/team'
import { memberships } from '../../../db/schema'

/** Makes a coach head coach or back: the head coach only, and the team always keeps one head coach. */
export default defineEventHandler(async (event) => {
  const caller = await requireHeadCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { role } = await readBodyWith(event, memberRoleSchema)
  const db = await useDb()
  const [member] = await db.select({ role: memberships.role }).from(memberships)
    .where(and(eq(memberships.teamId, caller.teamId), eq(memberships.userId, id))).limit(1)
  if (!member) notFound('No such member')
  if (member.role === 'athlete') {
    refuseField('role', 'Athletes keep their role; invite them as a coach instead')
  }
  if (member.role === 'head_coach' && role !== 'head_coach' && await headCoachCount(db, caller.teamId, id) === 0) {
    refuseField('role', 'The team needs a head coach; make someone else head coach first', 409)
  }
  await db.update(memberships).set({ role }).where(and(eq(memberships.teamId, caller.teamId), eq(memberships.userId, id)))
  forgetCallers({ userId: id, teamId: caller.teamId })
  return { id, role }
})
