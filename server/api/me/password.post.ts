import { eq } from 'drizzle-orm'
import { changePasswordSchema } from '#shared/schemas/auth'
import { users } from '../../db/schema'

// Changing the password keeps this session and ends every other one.
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event)
  const input = await readBodyWith(event, changePasswordSchema)
  const ip = clientAddress(event)
  await assertLoginAllowed(caller.email, ip)
  const db = await useDb()
  const [user] = await db.select({ passwordHash: users.passwordHash }).from(users).where(eq(users.id, caller.userId)).limit(1)
  if (!user || !(await verifyPassword(user.passwordHash, input.currentPassword))) {
    await recordLoginFailure(caller.email, ip)
    refuseField('currentPassword', 'This is not your current password')
  }
  await db.update(users).set({ passwordHash: await hashPassword(input.newPassword) }).where(eq(users.id, caller.userId))
  const ended = await endAllSignIns(caller.userId, await currentSid(event))
  return { ok: true, endedSessions: ended }
})
