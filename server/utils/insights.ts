import type { PainFlagReason } from '#shared/utils/vocabulary'
import { and, asc, between, desc, eq, gte, inArray, isNotNull, lte, sql } from 'drizzle-orm'
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core'
import type { Database } from '../db/client'
import { assignments, entryLogs, exercises, memberships, painFlags, sessionLogs, squadMembers, squads, users } from '../db/schema'
import {
  compliance, RATIO_LOOKBACK_DAYS, ratiosOn, roundKg, roundLoad, roundVolume, weeklyLoads,
  type Compliance, type DailyLoad,
} from '#shared/utils/insights'
import { addDays, daysBetween, startOfWeek, todayIn } from '#shared/utils/dates'
import { e1rmEpley, volumeLoad } from '#shared/utils/strength'
import { isFormerMember, shownAthleteName } from './former-athletes'

// An assignment counts as done when the athlete finished a session for it, or marked it done or partly done.
// Written with qualified names: drizzle leaves columns unqualified in single-table selects, which would
// make the inner query compare session_logs with itself.
const doneExpression = sql<number>`case when "assignments"."status" in ('done', 'partial') or exists (
  select 1 from "session_logs" as "done_logs" where "done_logs"."assignment_id" = "assignments"."id" and "done_logs"."finished_at" is not null
) then 1 else 0 end`

/** Epley is meant for lower rep counts; sets above 12 reps count for volume but not for the 1RM estimate. */
const MAX_REPS_FOR_ESTIMATE = 12

export interface AssignedCount {
  date: string
  assigned: number
  done: number
}

/** Compliance over the `days` days ending today; assignments after today are not counted yet. */
export function complianceOver(counts: readonly AssignedCount[], today: string, days: number): Compliance {
  const from = addDays(today, -(days - 1))
  let assigned = 0
  let done = 0
  for (const count of counts) {
    if (count.date < from || count.date > today) continue
    assigned += count.assigned
    done += count.done
  }
  return compliance(done, assigned)
}

export interface TeamAthlete {
  id: number
  name: string
  timezone: string
  firstDay: string | null
  lastDay: string | null
  openPainFlags: number
}

/** The team's athletes (optionally one squad's), with first/last session day and open pain flags. */
export async function listTeamAthletes(db: Database, teamId: number, squadId?: number): Promise<TeamAthlete[]> {
  const firstDay = sql<string | null>`(select min(${sessionLogs.day}) from ${sessionLogs} where ${sessionLogs.athleteId} = ${users.id} and ${sessionLogs.teamId} = ${teamId})`
  const lastDay = sql<string | null>`(select max(${sessionLogs.day}) from ${sessionLogs} where ${sessionLogs.athleteId} = ${users.id} and ${sessionLogs.teamId} = ${teamId})`
  const openFlags = sql<number>`(select count(*) from ${painFlags} where ${painFlags.athleteId} = ${users.id} and ${painFlags.teamId} = ${teamId} and ${painFlags.status} = 'open')`
  const query = db.select({ id: users.id, name: users.name, timezone: users.timezone, firstDay, lastDay, openPainFlags: openFlags })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
  const rows = squadId
    ? await query.innerJoin(squadMembers, and(eq(squadMembers.userId, users.id), eq(squadMembers.squadId, squadId)))
        .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'athlete'))).orderBy(asc(users.name))
    : await query.where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'athlete'))).orderBy(asc(users.name))
  return rows.map(row => ({ ...row, openPainFlags: Number(row.openPainFlags) }))
}

/**
 * Athletes who have left the team but whose sessions it keeps, shown as the team sees them ("Former
 * athlete N" when anonymised), for the team's exports.
 */
export async function listFormerAthletes(db: Database, teamId: number): Promise<TeamAthlete[]> {
  const name = shownAthleteName(teamId, sessionLogs.athleteId)
  const rows = await db.select({ id: sessionLogs.athleteId, name, timezone: users.timezone, firstDay: sql<string | null>`min(${sessionLogs.day})`, lastDay: sql<string | null>`max(${sessionLogs.day})` })
    .from(sessionLogs).innerJoin(users, eq(users.id, sessionLogs.athleteId))
    .where(and(eq(sessionLogs.teamId, teamId), isFormerMember(teamId, sessionLogs.athleteId)))
    .groupBy(sessionLogs.athleteId)
    .orderBy(asc(name))
  return rows.map(row => ({ ...row, openPainFlags: 0 }))
}

async function teamAthleteOrNull(db: Database, teamId: number, athleteId: number) {
  const [athlete] = await listAthletesByIds(db, teamId, [athleteId])
  return athlete ?? null
}

async function listAthletesByIds(db: Database, teamId: number, ids: number[]) {
  if (!ids.length) return []
  return db.select({ id: users.id, name: users.name, timezone: users.timezone })
    .from(memberships).innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'athlete'), inArray(users.id, ids)))
}

function athleteFilter(column: SQLiteColumn, athleteIds?: number[]) {
  if (!athleteIds) return sql``
  if (!athleteIds.length) return sql` and 0`
  return sql` and ${inArray(column, athleteIds)}`
}

// Grouped rows come back as one packed text per athlete ("day value value,…"): the GROUP BY work stays in
// SQLite and the driver builds 100 row objects instead of thousands, which is most of the route's time.
function unpack(packed: string | null) {
  return (packed ?? '').split(',').filter(Boolean).map(item => item.split(' '))
}

/** Daily load totals and session counts per athlete, for the days from `from` to `to`. */
export async function dailyLoadsByAthlete(db: Database, teamId: number, from: string, to: string, athleteIds?: number[]) {
  const rows = await db.all<{ athleteId: number, packed: string | null }>(sql`
    select athlete_id as athleteId, group_concat(day || ' ' || total || ' ' || sessions, ',') as packed
    from (
      select ${sessionLogs.athleteId} as athlete_id, ${sessionLogs.day} as day, coalesce(sum(max(coalesce(${sessionLogs.load}, 0), 0)), 0) as total, count(*) as sessions
      from ${sessionLogs}
      where ${sessionLogs.teamId} = ${teamId} and ${sessionLogs.day} between ${from} and ${to}${athleteFilter(sessionLogs.athleteId, athleteIds)}
      group by ${sessionLogs.athleteId}, ${sessionLogs.day}
    )
    group by athlete_id`)
  const byAthlete = new Map<number, (DailyLoad & { sessions: number })[]>()
  for (const row of rows) {
    byAthlete.set(Number(row.athleteId), unpack(row.packed).map(([day, load, sessions]) => ({ day: day!, load: Number(load), sessions: Number(sessions) })))
  }
  return byAthlete
}

/** "day total,day total,…" as daily loads; one pass, as a year of a whole team's days goes through it. */
function unpackDayTotals(packed: string | null): DailyLoad[] {
  if (!packed) return []
  return packed.split(',').map((item) => {
    const space = item.indexOf(' ')
    return { day: item.slice(0, space), load: Number(item.slice(space + 1)) }
  })
}

interface TeamFigures {
  daily: DailyLoad[]
  compliance7: Compliance
  compliance28: Compliance
}

/**
 * What the team table needs of each athlete's history, each over the athlete's own days: the daily load totals
 * of the ratio's look-back ending on their today, and what was assigned and done in the last 7 and 28 days.
 * One statement walking each athlete's rows in day order through the (team, athlete, day) indexes, so nothing
 * is sorted; the day totals come back as text, as in dailyLoadsByAthlete, so the ratios read the same numbers.
 */
async function teamFigures(db: Database, teamId: number, todays: Map<number, string>) {
  const windows = JSON.stringify([...todays].map(([athlete, today]) => ({
    athlete, today, loadsFrom: addDays(today, -(RATIO_LOOKBACK_DAYS - 1)), from28: addDays(today, -27), from7: addDays(today, -6),
  })))
  // Materialised so that each bound is read out of the JSON once per athlete, not once per row compared.
  const rows = await db.all<{ athleteId: number, loads: string | null, counts: string }>(sql`
    with span as materialized (
      select value ->> 'athlete' as athlete, value ->> 'today' as today, value ->> 'loadsFrom' as loads_from,
        value ->> 'from28' as from28, value ->> 'from7' as from7
      from json_each(${windows})
    )
    select span.athlete as athleteId,
      (select group_concat(day || ' ' || total, ',') from (
        select ${sessionLogs.day} as day, sum(max(coalesce(${sessionLogs.load}, 0), 0)) as total
        from ${sessionLogs}
        where ${sessionLogs.teamId} = ${teamId} and ${sessionLogs.athleteId} = span.athlete
          and ${sessionLogs.day} between span.loads_from and span.today
        group by ${sessionLogs.day}
      )) as loads,
      (select count(*) || ' ' || coalesce(sum(${doneExpression}), 0) || ' '
          || count(*) filter (where ${assignments.date} >= span.from7) || ' '
          || coalesce(sum(${doneExpression}) filter (where ${assignments.date} >= span.from7), 0)
        from ${assignments}
        where ${assignments.teamId} = ${teamId} and ${assignments.athleteId} = span.athlete
          and ${assignments.date} between span.from28 and span.today
      ) as counts
    from span`)
  const figures = new Map<number, TeamFigures>()
  for (const row of rows) {
    const [assigned28, done28, assigned7, done7] = row.counts.split(' ').map(Number) as [number, number, number, number]
    figures.set(Number(row.athleteId), {
      daily: unpackDayTotals(row.loads),
      compliance7: compliance(done7, assigned7),
      compliance28: compliance(done28, assigned28),
    })
  }
  return figures
}

export interface TeamInsightsRow {
  athleteId: number
  name: string
  squads: { id: number, name: string }[]
  today: string
  compliance7: Compliance
  compliance28: Compliance
  lastSession: string | null
  weekLoad: number
  acwrRolling: number | null
  acwrEwma: number | null
  openPainFlags: number
}

/** Every row of the team table; three queries for the whole team, whatever its history. */
export async function teamInsightsRows(db: Database, teamId: number, squadId?: number, now = new Date()): Promise<TeamInsightsRow[]> {
  const athletes = await listTeamAthletes(db, teamId, squadId)
  if (!athletes.length) return []
  const todays = new Map(athletes.map(athlete => [athlete.id, todayIn(athlete.timezone, now)]))
  const [figures, squadLinks] = await Promise.all([
    teamFigures(db, teamId, todays),
    db.select({ userId: squadMembers.userId, id: squads.id, name: squads.name })
      .from(squadMembers).innerJoin(squads, eq(squads.id, squadMembers.squadId))
      .where(eq(squads.teamId, teamId)).orderBy(asc(squads.name)),
  ])
  return athletes.map((athlete) => {
    const today = todays.get(athlete.id)!
    const { daily, compliance7, compliance28 } = figures.get(athlete.id)!
    const weekStart = startOfWeek(today)
    const weekLoad = daily.filter(row => row.day >= weekStart && row.day <= today).reduce((total, row) => total + row.load, 0)
    return {
      athleteId: athlete.id,
      name: athlete.name,
      squads: squadLinks.filter(link => link.userId === athlete.id).map(({ id, name }) => ({ id, name })),
      today,
      compliance7,
      compliance28,
      lastSession: athlete.lastDay,
      weekLoad: roundLoad(weekLoad),
      ...ratiosOn(daily, athlete.firstDay, today),
      openPainFlags: athlete.openPainFlags,
    }
  })
}

function sortValue(row: TeamInsightsRow, key: string): string | number | null {
  switch (key) {
    case 'compliance7': return row.compliance7.percent
    case 'compliance28': return row.compliance28.percent
    case 'lastSession': return row.lastSession
    case 'weekLoad': return row.weekLoad
    case 'acwrRolling': return row.acwrRolling
    case 'acwrEwma': return row.acwrEwma
    case 'openPainFlags': return row.openPainFlags
    default: return row.name.toLocaleLowerCase()
  }
}

/** `name` ascending, `-name` descending; rows without a value go last either way, ties by name. */
export function sortTeamRows(rows: TeamInsightsRow[], sort: string): TeamInsightsRow[] {
  const descending = sort.startsWith('-')
  const key = descending ? sort.slice(1) : sort
  return [...rows].sort((a, b) => {
    const left = sortValue(a, key)
    const right = sortValue(b, key)
    if (left === null || right === null) {
      if (left === right) return a.name.localeCompare(b.name)
      return left === null ? 1 : -1
    }
    const order = left < right ? -1 : left > right ? 1 : 0
    return (descending ? -order : order) || a.name.localeCompare(b.name)
  })
}

export interface SessionRow {
  id: number
  day: string
  routine: string
  durationMin: number | null
  sessionRpe: number | null
  load: number | null
  pain: number | null
  painArea: string | null
  note: string
}

const routineTitle = sql<string>`coalesce(json_extract(${assignments.snapshot}, '$.title'), '')`

/** Sessions as the screen and the CSV show them (same rounding). */
export async function sessionRows(db: Database, teamId: number, options: { athleteIds?: number[], from: string, to: string, limit?: number, newestFirst?: boolean }) {
  const athleteName = shownAthleteName(teamId, sessionLogs.athleteId)
  const query = db.select({
    id: sessionLogs.id,
    athleteId: sessionLogs.athleteId,
    athleteName,
    day: sessionLogs.day,
    routine: routineTitle,
    durationS: sessionLogs.durationS,
    sessionRpe: sessionLogs.sessionRpe,
    load: sessionLogs.load,
    pain: sessionLogs.pain,
    painArea: sessionLogs.painArea,
    note: sessionLogs.note,
  }).from(sessionLogs)
    .innerJoin(assignments, eq(assignments.id, sessionLogs.assignmentId))
    .innerJoin(users, eq(users.id, sessionLogs.athleteId))
    .where(and(
      eq(sessionLogs.teamId, teamId),
      between(sessionLogs.day, options.from, options.to),
      options.athleteIds ? inArray(sessionLogs.athleteId, options.athleteIds) : undefined,
    ))
    .orderBy(...(options.newestFirst ? [desc(sessionLogs.day), desc(sessionLogs.id)] : [asc(athleteName), asc(sessionLogs.day), asc(sessionLogs.id)]))
  const rows = options.limit ? await query.limit(options.limit) : await query
  return rows.map(row => ({
    athleteId: row.athleteId,
    athleteName: row.athleteName,
    ...toSessionRow(row),
  }))
}

function toSessionRow(row: { id: number, day: string, routine: string, durationS: number | null, sessionRpe: number | null, load: number | null, pain: number | null, painArea: string | null, note: string }): SessionRow {
  return {
    id: row.id,
    day: row.day,
    routine: row.routine,
    durationMin: row.durationS === null ? null : Math.round(row.durationS / 60),
    sessionRpe: row.sessionRpe,
    load: row.load === null ? null : roundLoad(Math.max(row.load, 0)),
    pain: row.pain,
    painArea: row.painArea,
    note: row.note,
  }
}

export interface PainFlagView {
  id: number
  athleteId: number
  athleteName: string
  /** No longer in the team: their history stays, their report and replies do not. */
  formerAthlete: boolean
  sessionId: number
  day: string
  routine: string
  note: string
  pain: number
  area: string | null
  reason: PainFlagReason
  sudden: boolean
  status: 'open' | 'acknowledged'
  reply: string | null
  acknowledgedBy: string | null
  acknowledgedAt: string | null
  createdAt: string
}

export async function listPainFlags(db: Database, teamId: number, options: { id?: number, status?: 'open' | 'acknowledged', athleteId?: number, limit?: number } = {}): Promise<PainFlagView[]> {
  const rows = await db.select({
    id: painFlags.id,
    athleteId: painFlags.athleteId,
    athleteName: shownAthleteName(teamId, painFlags.athleteId),
    formerAthlete: isFormerMember(teamId, painFlags.athleteId),
    sessionId: painFlags.sessionId,
    day: sessionLogs.day,
    routine: routineTitle,
    note: sessionLogs.note,
    pain: painFlags.pain,
    area: painFlags.area,
    reason: painFlags.reason,
    sudden: painFlags.sudden,
    status: painFlags.status,
    reply: painFlags.reply,
    acknowledgedBy: sql<string | null>`(select ${users.name} from ${users} where ${users.id} = ${painFlags.acknowledgedById})`,
    acknowledgedAt: painFlags.acknowledgedAt,
    createdAt: painFlags.createdAt,
  }).from(painFlags)
    .innerJoin(users, eq(users.id, painFlags.athleteId))
    .innerJoin(sessionLogs, eq(sessionLogs.id, painFlags.sessionId))
    .innerJoin(assignments, eq(assignments.id, sessionLogs.assignmentId))
    .where(and(
      eq(painFlags.teamId, teamId),
      options.id ? eq(painFlags.id, options.id) : undefined,
      options.status ? eq(painFlags.status, options.status) : undefined,
      options.athleteId ? eq(painFlags.athleteId, options.athleteId) : undefined,
    ))
    .orderBy(desc(sessionLogs.day), desc(painFlags.id))
    .limit(options.limit ?? 200)
  return rows.map(row => ({
    ...row,
    formerAthlete: Boolean(row.formerAthlete),
    acknowledgedAt: row.acknowledgedAt ? row.acknowledgedAt.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
  }))
}

export interface StrengthTrend {
  exerciseId: number
  name: string
  points: { day: string, bestE1rmKg: number | null, volumeLoadKg: number }[]
}

/** Per exercise and session date: the best Epley estimate among the day's sets and the day's volume load. */
export async function strengthTrends(db: Database, teamId: number, athleteId: number, from: string, to: string): Promise<StrengthTrend[]> {
  // Identical sets are grouped in SQL; each group is expanded back to its sets for the shared formulas.
  const rows = await db.select({
    exerciseId: entryLogs.exerciseId,
    name: exercises.name,
    day: sessionLogs.day,
    kg: entryLogs.kg,
    reps: entryLogs.reps,
    sets: sql<number>`count(*)`,
  }).from(entryLogs)
    .innerJoin(sessionLogs, eq(sessionLogs.id, entryLogs.sessionId))
    .innerJoin(exercises, eq(exercises.id, entryLogs.exerciseId))
    .where(and(
      eq(entryLogs.athleteId, athleteId),
      eq(entryLogs.teamId, teamId),
      isNotNull(entryLogs.exerciseId),
      gte(entryLogs.kg, 0),
      lte(entryLogs.kg, 1000),
      gte(entryLogs.reps, 1),
      lte(entryLogs.reps, 100),
      between(sessionLogs.day, from, to),
    ))
    .groupBy(entryLogs.exerciseId, sessionLogs.day, entryLogs.kg, entryLogs.reps)
    .orderBy(asc(exercises.name), asc(sessionLogs.day))
  const trends = new Map<number, { name: string, days: Map<string, { kg: number, reps: number, sets: number }[]> }>()
  for (const row of rows) {
    const trend = trends.get(row.exerciseId!) ?? { name: row.name, days: new Map() }
    const day = trend.days.get(row.day) ?? []
    day.push({ kg: row.kg!, reps: row.reps!, sets: Number(row.sets) })
    trend.days.set(row.day, day)
    trends.set(row.exerciseId!, trend)
  }
  return [...trends].map(([exerciseId, trend]) => ({
    exerciseId,
    name: trend.name,
    points: [...trend.days].map(([day, groups]) => {
      const estimates = groups.filter(group => group.kg > 0 && group.reps <= MAX_REPS_FOR_ESTIMATE).map(group => e1rmEpley(group.kg, group.reps))
      const entries = groups.flatMap(group => Array.from({ length: group.sets }, () => ({ kg: group.kg, reps: group.reps })))
      return {
        day,
        bestE1rmKg: estimates.length ? roundKg(Math.max(...estimates)) : null,
        volumeLoadKg: roundVolume(volumeLoad(entries)),
      }
    }),
  }))
}

/** Everything on one athlete's page; the athlete must be in `teamId` (callers check who may see it). */
const CALENDAR_MAX_DAYS = 26 * 7

export async function athleteInsights(db: Database, teamId: number, athleteId: number, weeks = 12, now = new Date()) {
  const athlete = await teamAthleteOrNull(db, teamId, athleteId)
  if (!athlete) return null
  const today = todayIn(athlete.timezone, now)
  const from = addDays(startOfWeek(today), -(weeks - 1) * 7)
  // The calendar covers the athlete's whole block: every planned session from up to 26 weeks back to
  // 26 weeks ahead, and never less than the last five weeks and this one.
  const [span] = await db.select({ first: sql<string | null>`min(${assignments.date})`, last: sql<string | null>`max(${assignments.date})` })
    .from(assignments)
    .where(and(eq(assignments.teamId, teamId), eq(assignments.athleteId, athleteId), between(assignments.date, addDays(today, -CALENDAR_MAX_DAYS), addDays(today, CALENDAR_MAX_DAYS))))
  const defaultFrom = addDays(startOfWeek(today), -5 * 7)
  const defaultTo = addDays(startOfWeek(today), 6)
  const calendarFrom = span?.first && span.first < defaultFrom ? startOfWeek(span.first) : defaultFrom
  const calendarTo = span?.last && span.last > defaultTo ? addDays(startOfWeek(span.last), 6) : defaultTo
  const [[bounds], loads, calendarRows, painRows, flags, strength, sessions] = await Promise.all([
    db.select({ firstDay: sql<string | null>`min(${sessionLogs.day})`, lastDay: sql<string | null>`max(${sessionLogs.day})` })
      .from(sessionLogs).where(and(eq(sessionLogs.athleteId, athleteId), eq(sessionLogs.teamId, teamId))),
    dailyLoadsByAthlete(db, teamId, addDays(from, -(RATIO_LOOKBACK_DAYS - 1)), today, [athleteId]),
    db.select({ id: assignments.id, date: assignments.date, title: routineTitle, status: assignments.status, done: doneExpression })
      .from(assignments)
      .where(and(eq(assignments.teamId, teamId), eq(assignments.athleteId, athleteId), between(assignments.date, addDays(today, -27) < calendarFrom ? addDays(today, -27) : calendarFrom, calendarTo)))
      .orderBy(asc(assignments.date), asc(assignments.id)),
    db.select({ sessionId: sessionLogs.id, day: sessionLogs.day, pain: sessionLogs.pain, area: sessionLogs.painArea })
      .from(sessionLogs)
      .where(and(eq(sessionLogs.teamId, teamId), eq(sessionLogs.athleteId, athleteId), isNotNull(sessionLogs.pain), between(sessionLogs.day, from, today)))
      .orderBy(asc(sessionLogs.day), asc(sessionLogs.id)),
    listPainFlags(db, teamId, { athleteId, limit: 50 }),
    strengthTrends(db, teamId, athleteId, from, today),
    sessionRows(db, teamId, { athleteIds: [athleteId], from: addDays(today, -365), to: today, limit: 20, newestFirst: true }),
  ])
  const daily = loads.get(athleteId) ?? []
  const counts = new Map<string, AssignedCount>()
  for (const row of calendarRows) {
    const count = counts.get(row.date) ?? { date: row.date, assigned: 0, done: 0 }
    count.assigned += 1
    count.done += Number(row.done)
    counts.set(row.date, count)
  }
  const sessionsByDay = new Map(daily.map(row => [row.day, row]))
  const calendar = Array.from({ length: daysBetween(calendarFrom, calendarTo) + 1 }, (_, index) => {
    const day = addDays(calendarFrom, index)
    return {
      day,
      future: day > today,
      assignments: calendarRows.filter(row => row.date === day).map(row => ({ id: row.id, title: row.title, status: row.status, done: Boolean(Number(row.done)) })),
      sessions: sessionsByDay.get(day)?.sessions ?? 0,
      load: roundLoad(sessionsByDay.get(day)?.load ?? 0),
    }
  })
  const weekly = weeklyLoads(daily, bounds?.firstDay ?? null, from, today)
  const current = weekly.at(-1)!
  return {
    athlete: { id: athlete.id, name: athlete.name, timezone: athlete.timezone },
    today,
    summary: {
      compliance7: complianceOver([...counts.values()], today, 7),
      compliance28: complianceOver([...counts.values()], today, 28),
      lastSession: bounds?.lastDay ?? null,
      weekLoad: current.load,
      acwrRolling: current.acwrRolling,
      acwrEwma: current.acwrEwma,
      openPainFlags: flags.filter(flag => flag.status === 'open').length,
    },
    weeks: weekly,
    calendar,
    pain: painRows.map(row => ({ ...row, pain: row.pain! })),
    painFlags: flags,
    strength,
    sessions: sessions.map(({ athleteId: _athlete, athleteName: _name, ...row }) => row),
    notes: sessions.filter(row => row.note.trim() !== '').slice(0, 10).map(row => ({ sessionId: row.id, day: row.day, routine: row.routine, note: row.note })),
  }
}

export type AthleteInsights = NonNullable<Awaited<ReturnType<typeof athleteInsights>>>
