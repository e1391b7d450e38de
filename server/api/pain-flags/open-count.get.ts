import { and, count, eq } from 'drizzle-orm'
import { painFlags } from '../../db/schema'

/** How many pain reports no coach has looked at yet: the navigation's badge. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  const [row] = await db.select({ open: count() }).from(painFlags)
    .where(and(eq(painFlags.teamId, caller.teamId), eq(painFlags.status, 'open')))
  return { open: row?.open ?? 0 }
})
