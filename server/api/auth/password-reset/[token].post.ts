import { and, eq, isNull } from 'drizzle-orm'
import { passwordResetSchema, tokenParamsSchema } from '#shared/schemas/auth'
import { passwordResets, users } from '../../../db/schema'

export default defineEventHandler(async (event) => {
  const { token } = paramsWith(event, tokenParamsSchema)
  const { password } = await readBodyWith(event, passwordResetSchema)
  const db = await useDb()
  const [reset] = await db.select().from(passwordResets).where(eq(passwordResets.tokenHash, hashToken(token))).limit(1)
  if (!reset) notFound('This reset link is not valid')
  if (reset.usedAt || reset.expiresAt.getTime() < Date.now()) {
    refuse(410, 'This reset link has expired or was already used; ask for a new one')
  }
  const passwordHash = await hashPassword(password)
  await db.transaction(async (tx) => {
    const used = await tx.update(passwordResets).set({ usedAt: new Date() })
      .where(and(eq(passwordResets.id, reset.id), isNull(passwordResets.usedAt))).returning({ id: passwordResets.id })
    if (used.length === 0) refuse(410, 'This reset link was already used')
    // Using one link spends every other outstanding link of this person.
    await tx.update(passwordResets).set({ usedAt: new Date() })
      .where(and(eq(passwordResets.userId, reset.userId), isNull(passwordResets.usedAt)))
    await tx.update(users).set({ passwordHash }).where(eq(users.id, reset.userId))
  })
  // A new password ends every session, wherever it was opened.
  await endAllSignIns(reset.userId)
  await clearLoginFailures((await db.select({ email: users.email }).from(users).where(eq(users.id, reset.userId)))[0]?.email ?? '')
  return { ok: true }
})
