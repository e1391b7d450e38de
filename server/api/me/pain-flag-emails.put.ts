import { and, eq } from 'drizzle-orm'
import { painFlagEmailsSchema } from '#shared/schemas/safety'
import { memberships } from '../../db/schema'

/** Turns the caller's e-mails about new pain reports on or off (coaches only). */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { painFlagEmails } = await readBodyWith(event, painFlagEmailsSchema)
  const db = await useDb()
  await db.update(memberships).set({ painFlagEmails }).where(and(eq(memberships.teamId, caller.teamId), eq(memberships.userId, caller.userId)))
  return { painFlagEmails }
})
