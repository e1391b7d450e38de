import { eq } from 'drizzle-orm'
import { passwordResetRequestSchema } from '#shared/schemas/auth'
import { passwordResets, users } from '../../db/schema'

// Always 202, so the answer never tells whether an address has an account.
export default defineEventHandler(async (event) => {
  const { email } = await readBodyWith(event, passwordResetRequestSchema)
  const db = await useDb()
  const [user] = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1)
  if (user) {
    const { token, hash } = newToken()
    await db.transaction(async (tx) => {
      await tx.insert(passwordResets).values({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + 3600_000) })
      await enqueueEmail(tx, { to: email, template: 'password_reset', payload: { url: `${useServerConfig().appUrl}/reset/${token}` } })
    })
  }
  setResponseStatus(event, 202)
  return { ok: true }
})
