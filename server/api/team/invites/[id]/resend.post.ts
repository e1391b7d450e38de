import { and, eq, isNull } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { invites } from '../../../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const [invite] = await db.select().from(invites)
    .where(and(eq(invites.id, id), eq(invites.teamId, caller.teamId), isNull(invites.acceptedAt), isNull(invites.revokedAt))).limit(1)
  if (!invite) notFound('No such pending invitation')
  assertMayInvite(caller, invite.role)
  await takeAllowance(mailRules(invite.email, clientAddress(event), caller.teamId))
  const { expiresAt } = await db.transaction(tx => sendInvite(tx, invite, caller.name, caller.teamName))
  return { id: invite.id, expiresAt }
})
