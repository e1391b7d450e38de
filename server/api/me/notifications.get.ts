import { eq } from 'drizzle-orm'
import { users } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const db = await useDb()
  const [row] = await db.select({ notifyByEmail: users.notifyByEmail }).from(users).where(eq(users.id, caller.userId)).limit(1)
  return { notifyByEmail: row?.notifyByEmail ?? true }
})
