import { and, asc, eq } from 'drizzle-orm'
import { assignments, blocks } from '../../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { shownStatus } from '#shared/utils/assignment-status'
import { addDays, todayIn } from '#shared/utils/dates'
import { keyNumbers, weekOfBlock, type WeekKind } from '#shared/utils/progression'

/** The caller's own view of a block: every week, its sessions, what changed and what was done. 404 without sessions in it. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const [block] = await db.select().from(blocks).where(and(eq(blocks.id, id), eq(blocks.teamId, caller.teamId))).limit(1)
  if (!block) notFound('No such block')
  const rows = await db.select({ id: assignments.id, date: assignments.date, week: assignments.blockWeek, snapshot: assignments.snapshot, status: assignments.status })
    .from(assignments)
    .where(and(eq(assignments.teamId, caller.teamId), eq(assignments.athleteId, caller.userId), eq(assignments.blockId, id)))
    .orderBy(asc(assignments.date), asc(assignments.id))
  if (!rows.length) notFound('No such block')
  const today = todayIn(caller.timezone)
  const weeks = Array.from({ length: block.weeks }, (_, index) => {
    const week = index + 1
    const sessions = rows.filter(row => row.week === week)
    const kind: WeekKind = sessions[0]?.snapshot.block?.kind ?? 'regular'
    return {
      week,
      startDate: addDays(block.startDate, index * 7),
      kind,
      sessions: sessions.map(row => ({
        id: row.id,
        date: row.date,
        title: row.snapshot.title,
        category: row.snapshot.category,
        shownStatus: shownStatus(row.status, row.date, today),
        changes: row.snapshot.block?.changes ?? [],
        numbers: keyNumbers(row.snapshot.steps),
      })),
    }
  })
  return {
    block: { id: block.id, name: block.name, startDate: block.startDate, weeks: block.weeks, goalRace: block.goalRaceDate ? { name: block.goalRaceName, date: block.goalRaceDate, distanceM: block.goalRaceDistanceM } : null, note: block.note },
    today,
    currentWeek: weekOfBlock(block.startDate, block.weeks, today),
    weeks,
  }
})
