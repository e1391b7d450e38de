import { and, asc, eq, gte, isNull, lte } from 'drizzle-orm'
import ical, { ICalCalendarMethod } from 'ical-generator'
import { assignments, calendarFeeds, memberships, teams, users } from '../../db/schema'
import { shownStatus } from '#shared/utils/assignment-status'
import { routineCategories, shownStatuses } from '#shared/utils/vocabulary'
import { addDays, dayToUtcDate, isCalendarDay, todayIn } from '#shared/utils/dates'
import { blockWeekLine } from '#shared/utils/block-week'

const FEED_PAST_DAYS = 60
// Plan dates are kept within five years (shared/schemas/common.ts); older rows beyond it are left out.
const FEED_FUTURE_DAYS = 5 * 366

/** One athlete's plan as an iCalendar (RFC 5545) feed of all-day events; the token is the only key. */
export default defineEventHandler(async (event) => {
  // The router names this segment's parameter after the whole file name ("token.ics"): take the one there is.
  const raw = String(Object.values(getRouterParams(event, { decode: true }))[0] ?? '')
  const token = raw.replace(/\.ics$/, '')
  if (token.length < 20 || token.length > 200) notFound('No such calendar')
  const db = await useDb()
  const [feed] = await db.select({ teamId: calendarFeeds.teamId, userId: calendarFeeds.userId, timezone: users.timezone, teamName: teams.name })
    .from(calendarFeeds)
    .innerJoin(users, eq(users.id, calendarFeeds.userId))
    .innerJoin(teams, eq(teams.id, calendarFeeds.teamId))
    .innerJoin(memberships, and(eq(memberships.userId, calendarFeeds.userId), eq(memberships.teamId, calendarFeeds.teamId)))
    .where(and(eq(calendarFeeds.tokenHash, hashToken(token)), isNull(calendarFeeds.revokedAt)))
    .limit(1)
  if (!feed) notFound('No such calendar')

  const today = todayIn(feed.timezone)
  const rows = await db.select({ id: assignments.id, date: assignments.date, snapshot: assignments.snapshot, note: assignments.note, status: assignments.status, updatedAt: assignments.updatedAt })
    .from(assignments)
    .where(and(eq(assignments.teamId, feed.teamId), eq(assignments.athleteId, feed.userId), gte(assignments.date, addDays(today, -FEED_PAST_DAYS)), lte(assignments.date, addDays(today, FEED_FUTURE_DAYS))))
    .orderBy(asc(assignments.date), asc(assignments.id))

  const { appUrl } = useServerConfig()
  const host = new URL(appUrl).host
  const calendar = ical({ name: `Switchback · ${feed.teamName}`, prodId: { company: 'Switchback', product: 'planner', language: 'EN' }, method: ICalCalendarMethod.PUBLISH, ttl: 60 * 60 })
  for (const row of rows) {
    // One unreadable row (a malformed date or snapshot from older data) is skipped, not the whole feed.
    try {
      addToCalendar(row)
    }
    catch (error) {
      console.warn(`Calendar feed skipped assignment ${row.id}:`, (error as Error).message)
    }
  }
  function addToCalendar(row: typeof rows[number]) {
    const status = shownStatuses.labels[shownStatus(row.status, row.date, today)]
    const url = `${appUrl}/session/${row.id}`
    if (!isCalendarDay(row.date)) throw new Error(`not a calendar day: ${row.date}`)
    calendar.createEvent({
      id: `assignment-${row.id}@${host}`,
      allDay: true,
      start: dayToUtcDate(row.date),
      end: dayToUtcDate(addDays(row.date, 1)),
      stamp: row.updatedAt,
      lastModified: row.updatedAt,
      summary: row.snapshot.title,
      description: [
        `${routineCategories.label(row.snapshot.category)} · ${status}`,
        row.snapshot.block ? blockWeekLine(row.snapshot.block) : '',
        row.note ? `Note from your coach: ${row.note}` : '',
        url,
      ].filter(Boolean).join('\n\n'),
      url,
      categories: [{ name: routineCategories.label(row.snapshot.category) }],
    })
  }
  setResponseHeader(event, 'content-type', 'text/calendar; charset=utf-8')
  setResponseHeader(event, 'cache-control', 'private, max-age=300')
  setResponseHeader(event, 'content-disposition', 'inline; filename="switchback.ics"')
  return calendar.toString()
})
