import { and, eq, isNull } from 'drizzle-orm'
import type { Database } from '../db/client'
import { calendarFeeds } from '../db/schema'

/** Revokes the caller's current feed and, unless `revokeOnly`, issues a new one. The token is shown once. */
export async function replaceCalendarFeed(db: Database, teamId: number, userId: number, { revokeOnly = false } = {}) {
  return db.transaction(async (tx) => {
    await tx.update(calendarFeeds).set({ revokedAt: new Date() })
      .where(and(eq(calendarFeeds.teamId, teamId), eq(calendarFeeds.userId, userId), isNull(calendarFeeds.revokedAt)))
    if (revokeOnly) return null
    const { token, hash } = newToken()
    const [feed] = await tx.insert(calendarFeeds).values({ teamId, userId, tokenHash: hash }).returning({ createdAt: calendarFeeds.createdAt })
    return { url: `${useServerConfig().appUrl}/calendar/${token}.ics`, createdAt: feed!.createdAt }
  })
}
