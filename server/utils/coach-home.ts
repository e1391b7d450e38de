import { sql } from 'drizzle-orm'
import type { Database } from '../db/client'
import { addDays, todayIn } from '#shared/utils/dates'
import { RATIO_LOOKBACK_DAYS, ratioBand, ratiosOn, type DailyLoad } from '#shared/utils/insights'
import { listPainFlags } from './insights'

export interface HomeAthleteDay {
  athleteId: number
  name: string
  /** Sessions planned for that day and how many were logged. */
  planned: number
  done: number
  trained: boolean
}

export interface HomeSquadDays {
  squadId: number | null
  squadName: string
  yesterday: HomeAthleteDay[]
  today: HomeAthleteDay[]
}

export interface HomeInvite {
  id: number
  email: string
  role: 'coach' | 'athlete'
  expiresAt: Date
}

/** The home's statements, all run side by side: one round trip, however many athletes the team has. */
export const COACH_HOME_STATEMENTS = 3

interface TeamRow {
  timezone: string | null
  checklistDismissedAt: number | null
  coaches: number
  coachInvites: number
  athletes: number
  athleteInvites: number
  squads: number
  exercises: number
  routines: number
  planned: number
  reviewsWaiting: number
  invites: string
  upcoming: string
}

interface AthleteRow {
  id: number
  name: string
  timezone: string
  firstDay: string | null
  loads: string | null
  plan: string | null
  squads: string | null
}

/**
 * The team's settings, the checklist's counts, form-review clips waiting for an answer, pending
 * invitations and the plan of the days around today, in one row. The upcoming days are read from
 * `upcomingFrom` to `upcomingTo` (wide enough for any time zone) and narrowed once "today" is known.
 */
function teamSummary(db: Database, teamId: number, now: Date, upcomingFrom: string, upcomingTo: string) {
  return db.all<TeamRow>(sql`
    select t.timezone as timezone, t.checklist_dismissed_at as checklistDismissedAt,
      (select count(*) from memberships where team_id = t.id and role != 'athlete') as coaches,
      (select count(*) from invites where team_id = t.id and role = 'coach' and revoked_at is null) as coachInvites,
      (select count(*) from memberships where team_id = t.id and role = 'athlete') as athletes,
      (select count(*) from invites where team_id = t.id and role = 'athlete' and revoked_at is null) as athleteInvites,
      (select count(*) from squads where team_id = t.id) as squads,
      (select count(*) from exercises where team_id = t.id) as exercises,
      (select count(*) from routines where team_id = t.id and is_template = 0) as routines,
      (select count(*) from assignments where team_id = t.id) as planned,
      (select count(*) from form_reviews where team_id = t.id and status = 'open') as reviewsWaiting,
      (select json_group_array(json_array(id, email, role, expires_at)) from (
        select id, email, role, expires_at from invites
        where team_id = t.id and accepted_at is null and revoked_at is null and expires_at > ${now.getTime()}
        order by created_at, id)) as invites,
      (select json_group_array(json_array(date, title, athletes)) from (
        select date, json_extract(snapshot, '$.title') as title, count(*) as athletes from assignments
        where team_id = t.id and date between ${upcomingFrom} and ${upcomingTo}
        group by date, title order by date, title)) as upcoming
    from teams as t where t.id = ${teamId}`)
}

/**
 * Every current athlete with what the home needs of them: their squads, the day of their first session,
 * their daily loads over the ratio's look-back (from `loadsFrom`) and what was planned and done on the days
 * from `planFrom` to `planTo`. Grouped in SQLite and packed as JSON, one row per athlete.
 */
function athleteSummaries(db: Database, teamId: number, loadsFrom: string, planFrom: string, planTo: string) {
  return db.all<AthleteRow>(sql`
    with daily as (
      select athlete_id, day, coalesce(sum(max(coalesce(load, 0), 0)), 0) as total, count(*) as sessions
      from session_logs where team_id = ${teamId} and day between ${loadsFrom} and ${planTo}
      group by athlete_id, day
    ),
    loads as (
      select athlete_id, json_group_array(json_array(day, total, sessions)) as packed from daily group by athlete_id
    ),
    plan as (
      select athlete_id, json_group_array(json_array(date, planned, done)) as packed from (
        select athlete_id, date, count(*) as planned, sum(case when status in ('done', 'partial') then 1 else 0 end) as done
        from assignments where team_id = ${teamId} and date between ${planFrom} and ${planTo}
        group by athlete_id, date)
      group by athlete_id
    ),
    links as (
      select squad_members.user_id, json_group_array(json_array(squads.id, squads.name)) as packed
      from squad_members join squads on squads.id = squad_members.squad_id
      where squads.team_id = ${teamId} group by squad_members.user_id
    )
    select users.id as id, users.name as name, users.timezone as timezone,
      (select min(day) from session_logs where athlete_id = users.id and team_id = ${teamId}) as firstDay,
      loads.packed as loads, plan.packed as plan, links.packed as squads
    from memberships
    join users on users.id = memberships.user_id
    left join loads on loads.athlete_id = users.id
    left join plan on plan.athlete_id = users.id
    left join links on links.user_id = users.id
    where memberships.team_id = ${teamId} and memberships.role = 'athlete'
    order by users.name, users.id`)
}

function parsed<T>(packed: string | null | undefined): T[] {
  return packed ? JSON.parse(packed) as T[] : []
}

/**
 * What a coach checks each morning, for one team, in three statements run side by side: open pain flags,
 * who trained or missed yesterday and today (per squad), the next seven days' plan, acute:chronic ratios
 * outside the commonly cited band, pending invitations, form-review clips waiting and the first-run checklist.
 * The ratios go through the same `ratiosOn` as the insights table, over the same daily loads.
 */
export async function coachHome(db: Database, teamId: number, now = new Date()) {
  // "Today" somewhere on Earth is never more than a day from today in UTC, so the ranges below cover
  // the team's days and every athlete's without reading the time zones first.
  const utcToday = todayIn('UTC', now)
  const earliestToday = addDays(utcToday, -1)
  const latestToday = addDays(utcToday, 1)
  const [[team], flags, athleteRows] = await Promise.all([
    teamSummary(db, teamId, now, utcToday, addDays(latestToday, 7)),
    listPainFlags(db, teamId, { status: 'open', limit: 20 }),
    athleteSummaries(db, teamId, addDays(earliestToday, -(RATIO_LOOKBACK_DAYS - 1)), addDays(earliestToday, -1), latestToday),
  ])
  const today = todayIn(team?.timezone ?? 'UTC', now)
  const yesterday = addDays(today, -1)
  const weekEnd = addDays(today, 7)

  const groups = new Map<number | null, HomeSquadDays>()
  const ratios: { athleteId: number, name: string, ratio: number | null, band: 'low' | 'high' }[] = []
  for (const athlete of athleteRows) {
    const daily = parsed<[string, number, number]>(athlete.loads).map(([day, load, sessions]) => ({ day, load: Number(load), sessions: Number(sessions) }))
    const plan = new Map(parsed<[string, number, number]>(athlete.plan).map(([date, planned, done]) => [date, { planned: Number(planned), done: Number(done) }]))
    const trainedOn = new Set(daily.filter(row => row.sessions > 0).map(row => row.day))
    const dayOf = (day: string): HomeAthleteDay => ({
      athleteId: Number(athlete.id),
      name: athlete.name,
      planned: plan.get(day)?.planned ?? 0,
      done: plan.get(day)?.done ?? 0,
      trained: trainedOn.has(day),
    })
    // An athlete with nothing planned and nothing logged on a day is left out of that day's list.
    const relevant = (entry: HomeAthleteDay) => entry.planned > 0 || entry.trained
    const squads = parsed<[number, string]>(athlete.squads).map(([id, name]) => ({ id: Number(id), name }))
      .sort((a, b) => a.name.localeCompare(b.name))
    for (const squad of squads.length ? squads : [{ id: null, name: 'No squad' }]) {
      const group = groups.get(squad.id) ?? { squadId: squad.id, squadName: squad.name, yesterday: [], today: [] }
      groups.set(squad.id, group)
      const y = dayOf(yesterday)
      const t = dayOf(today)
      if (relevant(y)) group.yesterday.push(y)
      if (relevant(t)) group.today.push(t)
    }
    const { acwrRolling } = ratiosOn(daily as DailyLoad[], athlete.firstDay, todayIn(athlete.timezone, now))
    const band = ratioBand(acwrRolling)
    if (band === 'low' || band === 'high') ratios.push({ athleteId: Number(athlete.id), name: athlete.name, ratio: acwrRolling, band })
  }

  const count = (key: keyof TeamRow) => Number(team?.[key] ?? 0)
  const checklist = {
    dismissed: Boolean(team?.checklistDismissedAt),
    steps: [
      { key: 'coaches', label: 'Invite your coaches', done: count('coaches') > 1 || count('coachInvites') > 0, to: '/team' },
      { key: 'athletes', label: 'Invite your athletes', done: count('athletes') > 0 || count('athleteInvites') > 0, to: '/team' },
      { key: 'squads', label: 'Make squads', done: count('squads') > 0, to: '/team' },
      { key: 'library', label: 'Review the exercise library', done: count('exercises') > 0, to: '/exercises' },
      { key: 'routine', label: 'Build or copy a first routine', done: count('routines') > 0, to: '/routines' },
      { key: 'plan', label: 'Plan a first week', done: count('planned') > 0, to: '/planner' },
    ],
  }

  return {
    today,
    yesterday,
    painFlags: flags,
    squads: [...groups.values()].filter(group => group.yesterday.length || group.today.length)
      .sort((a, b) => (a.squadId === null ? 1 : 0) - (b.squadId === null ? 1 : 0) || a.squadName.localeCompare(b.squadName)),
    upcoming: parsed<[string, string, number]>(team?.upcoming)
      .filter(([date]) => date > today && date <= weekEnd)
      .map(([date, title, athletes]) => ({ date, title, athletes: Number(athletes) })),
    ratios,
    invites: parsed<[number, string, 'coach' | 'athlete', number]>(team?.invites)
      .map(([id, email, role, expiresAt]): HomeInvite => ({ id: Number(id), email, role, expiresAt: new Date(Number(expiresAt)) })),
    /** Form-review clips waiting for a coach's answer (the review queue's "open" ones). */
    reviewsWaiting: count('reviewsWaiting'),
    checklist,
  }
}

export type CoachHome = Awaited<ReturnType<typeof coachHome>>
