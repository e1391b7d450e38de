import { and, count, eq } from 'drizzle-orm'
import { formReviews } from '../../db/schema'

/** How many clips wait for a coach's answer in the caller's team: the navigation's badge. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  const [row] = await db.select({ open: count() }).from(formReviews)
    .where(and(eq(formReviews.teamId, caller.teamId), eq(formReviews.status, 'open')))
  return { open: row?.open ?? 0 }
})
