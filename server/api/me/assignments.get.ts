import { and, asc, eq, gte, lte, sql } from 'drizzle-orm'
import type { AssignmentSnapshot } from '#shared/types/domain'
import { assignments } from '../../db/schema'
import { myAssignmentRangeSchema } from '#shared/schemas/planner'
import { shownStatus } from '#shared/utils/assignment-status'
import { addDays, todayIn } from '#shared/utils/dates'

/** The caller's own assignments (default: today and the next four weeks, plus `missedDays` before today), in their time zone. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const query = queryWith(event, myAssignmentRangeSchema)
  const today = todayIn(caller.timezone)
  const from = query.from ?? addDays(today, -(query.missedDays ?? 0))
  const to = query.to ?? addDays(query.from ?? today, 27)
  if (to < from) refuseField('to', 'The end comes before the start')
  const db = await useDb()
  const rows = await db.select({
    id: assignments.id,
    date: assignments.date,
    // Only the parts of the snapshot the list shows, read in SQL instead of parsing every snapshot.
    title: sql<string>`json_extract(${assignments.snapshot}, '$.title')`,
    category: sql<AssignmentSnapshot['category']>`json_extract(${assignments.snapshot}, '$.category')`,
    exerciseCount: sql<number>`coalesce(json_array_length(${assignments.snapshot}, '$.exercises'), 0)`,
    block: sql<string | null>`json_extract(${assignments.snapshot}, '$.block')`,
    note: assignments.note,
    status: assignments.status,
    seriesId: assignments.seriesId,
  }).from(assignments)
    .where(and(eq(assignments.teamId, caller.teamId), eq(assignments.athleteId, caller.userId), gte(assignments.date, from), lte(assignments.date, to)))
    .orderBy(asc(assignments.date), asc(assignments.id))
    .limit(500)
  return {
    today,
    timezone: caller.timezone,
    from,
    to,
    assignments: rows.map(({ title, category, exerciseCount, block, ...row }) => ({
      ...row,
      title,
      category,
      exerciseCount,
      block: block ? JSON.parse(block) as NonNullable<AssignmentSnapshot['block']> : null,
      shownStatus: shownStatus(row.status, row.date, today),
    })),
  }
})
