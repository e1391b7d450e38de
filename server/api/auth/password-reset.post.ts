import { eq } from 'drizzle-orm'
import { passwordResetRequestSchema } from '#shared/schemas/auth'
import { passwordResets, users } from '../../db/schema'

async function queueReset(email: string) {
  const db = await useDb()
  const [user] = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1)
  if (!user) return
  const { token, hash } = newToken()
  await db.transaction(async (tx) => {
    await tx.insert(passwordResets).values({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + 3600_000) })
    await enqueueEmail(tx, { to: email, template: 'password_reset', payload: { url: `${useServerConfig().appUrl}/reset/${token}` } })
  })
}

// Always 202, so the answer never tells whether an address has an account: the limits count every
// request alike, and the lookup and the queued mail happen after the answer has gone.
export default defineEventHandler(async (event) => {
  const { email } = await readBodyWith(event, passwordResetRequestSchema)
  await takeAllowance(mailRules(email, clientAddress(event)))
  event.waitUntil(queueReset(email).catch(error => console.error('Password reset request failed:', error)))
  setResponseStatus(event, 202)
  return { ok: true }
})
