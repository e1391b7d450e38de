import { and, desc, eq, isNull } from 'drizzle-orm'
import { calendarFeeds } from '../../db/schema'

/** Whether the caller has a working feed; its address was shown once when it was made. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const db = await useDb()
  const [feed] = await db.select({ createdAt: calendarFeeds.createdAt }).from(calendarFeeds)
    .where(and(eq(calendarFeeds.teamId, caller.teamId), eq(calendarFeeds.userId, caller.userId), isNull(calendarFeeds.revokedAt)))
    .orderBy(desc(calendarFeeds.id)).limit(1)
  return { active: Boolean(feed), createdAt: feed?.createdAt ?? null }
})
