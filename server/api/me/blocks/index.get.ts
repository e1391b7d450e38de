import { and, asc, eq, inArray } from 'drizzle-orm'
import { assignments, blocks } from '../../../db/schema'
import { todayIn } from '#shared/utils/dates'
import { weekOfBlock } from '#shared/utils/progression'

/** The blocks the caller has sessions in, with the week they are in now. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const db = await useDb()
  const mine = await db.selectDistinct({ blockId: assignments.blockId }).from(assignments)
    .where(and(eq(assignments.teamId, caller.teamId), eq(assignments.athleteId, caller.userId)))
  const ids = mine.flatMap(row => row.blockId ? [row.blockId] : [])
  if (!ids.length) return []
  const rows = await db.select({ id: blocks.id, name: blocks.name, startDate: blocks.startDate, weeks: blocks.weeks, goalRaceName: blocks.goalRaceName, goalRaceDate: blocks.goalRaceDate })
    .from(blocks).where(and(eq(blocks.teamId, caller.teamId), inArray(blocks.id, ids))).orderBy(asc(blocks.startDate))
  const today = todayIn(caller.timezone)
  return rows.map(row => ({ ...row, currentWeek: weekOfBlock(row.startDate, row.weeks, today) }))
})
