import { and, eq, isNull } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { invites } from '../../../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const [invite] = await db.select({ role: invites.role }).from(invites).where(and(eq(invites.id, id), eq(invites.teamId, caller.teamId))).limit(1)
  if (invite) assertMayInvite(caller, invite.role)
  const revoked = await db.update(invites).set({ revokedAt: new Date() })
    .where(and(eq(invites.id, id), eq(invites.teamId, caller.teamId), isNull(invites.acceptedAt), isNull(invites.revokedAt)))
    .returning({ id: invites.id })
  if (revoked.length === 0) notFound('No such pending invitation')
  setResponseStatus(event, 204)
  return null
})
