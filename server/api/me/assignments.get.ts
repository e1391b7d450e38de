import { and, asc, eq, gte, lte, sql } from 'drizzle-orm'
import type { AssignmentSnapshot } from '#shared/types/domain'
import { assignments } from '../../db/schema'
import { myAssignmentRangeSchema } from '#shared/schemas/planner'
import { shownStatus } from '#shared/utils/assignment-status'
import { addDays, todayIn } from '#shared/utils/dates'

// The same statement for every athlete, built once per database instead of on every request.
const listFor = builtOnce(db => db.select({
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
  .where(and(
    eq(assignments.teamId, sql.placeholder('teamId')),
    eq(assignments.athleteId, sql.placeholder('athleteId')),
    gte(assignments.date, sql.placeholder('from')),
    lte(assignments.date, sql.placeholder('to')),
  ))
  .orderBy(asc(assignments.date), asc(assignments.id))
  .limit(500)
  .prepare())

/** The caller's own assignments (default: today and the next four weeks, plus `missedDays` before today), in their time zone. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const query = queryWith(event, myAssignmentRangeSchema)
  const today = todayIn(caller.timezone)
  const from = query.from ?? addDays(today, -(query.missedDays ?? 0))
  const to = query.to ?? addDays(query.from ?? today, 27)
  if (to < from) refuseField('to', 'The end comes before the start')
  return keptAnswer(event, caller, async () => {
    const rows = await listFor(await useDb()).all({ teamId: caller.teamId, athleteId: caller.userId, from, to })
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
})
