import { eq } from 'drizzle-orm'
import { users } from '../../db/schema'
import { notificationsSchema } from '#shared/schemas/planner'

/** Turns the "new training" e-mails on or off for the caller. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { notifyByEmail } = await readBodyWith(event, notificationsSchema)
  const db = await useDb()
  await db.update(users).set({ notifyByEmail }).where(eq(users.id, caller.userId))
  return { notifyByEmail }
})
