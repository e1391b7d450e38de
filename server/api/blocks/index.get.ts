import { and, asc, count, eq, sql } from 'drizzle-orm'
import { assignments, blockRoutines, blocks } from '../../db/schema'
import { addDays } from '#shared/utils/dates'

/** The team's blocks, newest start first, with how far each has been planned. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  const rows = await db.select({
    id: blocks.id,
    name: blocks.name,
    startDate: blocks.startDate,
    weeks: blocks.weeks,
    goalRaceName: blocks.goalRaceName,
    goalRaceDate: blocks.goalRaceDate,
    plannedAt: blocks.plannedAt,
    upToDate: sql<number>`${blocks.plannedRevision} = ${blocks.revision}`,
    routineCount: sql<number>`(select count(*) from ${blockRoutines} where ${blockRoutines.blockId} = ${blocks.id})`,
  }).from(blocks).where(eq(blocks.teamId, caller.teamId)).orderBy(sql`${blocks.startDate} desc`, asc(blocks.id))
  const sessions = await db.select({ blockId: assignments.blockId, n: count() }).from(assignments)
    .where(and(eq(assignments.teamId, caller.teamId), sql`${assignments.blockId} is not null`)).groupBy(assignments.blockId)
  const byBlock = new Map(sessions.map(row => [row.blockId, row.n]))
  return rows.map(row => ({ ...row, upToDate: Boolean(row.upToDate), endDate: addDays(row.startDate, row.weeks * 7 - 1), sessions: byBlock.get(row.id) ?? 0 }))
})
