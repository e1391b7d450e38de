import { tokenParamsSchema } from '#shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const { token } = paramsWith(event, tokenParamsSchema)
  const db = await useDb()
  const { invite, teamName, inviterName } = await findUsableInvite(db, token)
  return { email: invite.email, role: invite.role, teamName, inviterName, expiresAt: invite.expiresAt }
})
