import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '../../../../shared/schemas/common'
import { memberRoleSchema } from '../../../../shared/schemas/team'
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
    throw createError({ statusCode: 400, statusMessage: 'Invalid input', message: 'role: Athletes keep their role; invite them as a coach instead', data: { fields: { role: 'Athletes keep their role; invite them as a coach instead' } } })
  }
  if (member.role === 'head_coach' && role !== 'head_coach' && await headCoachCount(db, caller.teamId, id) === 0) {
    throw createError({ statusCode: 409, statusMessage: 'Conflict', message: 'role: The team needs a head coach; make someone else head coach first', data: { fields: { role: 'The team needs a head coach; make someone else head coach first' } } })
  }
  await db.update(memberships).set({ role }).where(and(eq(memberships.teamId, caller.teamId), eq(memberships.userId, id)))
  return { id, role }
})
