import { and, asc, count, eq, gt, gte, isNull, lte, sql } from 'drizzle-orm'
import type { Database } from '../db/client'
import { assignments, exercises, invites, memberships, routines, sessionLogs, squads, teams } from '../db/schema'
import { addDays, todayIn } from '#shared/utils/dates'
import { ratioBand } from '#shared/utils/insights'

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

/**
 * What a coach checks each morning, for one team, in one round of queries run side by side:
 * open pain flags, who trained or missed yesterday and today (per squad), the next seven days' plan,
 * acute:chronic ratios outside the commonly cited band, pending invitations and the first-run checklist.
 */
export async function coachHome(db: Database, teamId: number, now = new Date()) {
  const [team] = await db.select({ timezone: teams.timezone, checklistDismissedAt: teams.checklistDismissedAt }).from(teams).where(eq(teams.id, teamId)).limit(1)
  const today = todayIn(team?.timezone ?? 'UTC', now)
  const yesterday = addDays(today, -1)
  const weekEnd = addDays(today, 7)

  const [flags, rows, recentPlan, recentLogs, upcoming, pending, counts] = await Promise.all([
    listPainFlags(db, teamId, { status: 'open', limit: 20 }),
    teamInsightsRows(db, teamId, undefined, now),
    db.select({ athleteId: assignments.athleteId, date: assignments.date, planned: count(), done: sql<number>`sum(case when ${assignments.status} in ('done', 'partial') then 1 else 0 end)` })
      .from(assignments).where(and(eq(assignments.teamId, teamId), gte(assignments.date, yesterday), lte(assignments.date, today)))
      .groupBy(assignments.athleteId, assignments.date),
    db.select({ athleteId: sessionLogs.athleteId, day: sessionLogs.day }).from(sessionLogs)
      .where(and(eq(sessionLogs.teamId, teamId), gte(sessionLogs.day, yesterday), lte(sessionLogs.day, today)))
      .groupBy(sessionLogs.athleteId, sessionLogs.day),
    db.select({ date: assignments.date, title: sql<string>`json_extract(${assignments.snapshot}, '$.title')`, athletes: count() })
      .from(assignments).where(and(eq(assignments.teamId, teamId), gt(assignments.date, today), lte(assignments.date, weekEnd)))
      .groupBy(assignments.date, sql`json_extract(${assignments.snapshot}, '$.title')`).orderBy(asc(assignments.date)),
    db.select({ id: invites.id, email: invites.email, role: invites.role, expiresAt: invites.expiresAt }).from(invites)
      .where(and(eq(invites.teamId, teamId), isNull(invites.acceptedAt), isNull(invites.revokedAt), gt(invites.expiresAt, now)))
      .orderBy(asc(invites.createdAt)),
    db.select({
      coaches: sql<number>`(select count(*) from ${memberships} where ${memberships.teamId} = ${teamId} and ${memberships.role} != 'athlete')`,
      coachInvites: sql<number>`(select count(*) from ${invites} where ${invites.teamId} = ${teamId} and ${invites.role} = 'coach' and ${invites.revokedAt} is null)`,
      athletes: sql<number>`(select count(*) from ${memberships} where ${memberships.teamId} = ${teamId} and ${memberships.role} = 'athlete')`,
      athleteInvites: sql<number>`(select count(*) from ${invites} where ${invites.teamId} = ${teamId} and ${invites.role} = 'athlete' and ${invites.revokedAt} is null)`,
      squads: sql<number>`(select count(*) from ${squads} where ${squads.teamId} = ${teamId})`,
      exercises: sql<number>`(select count(*) from ${exercises} where ${exercises.teamId} = ${teamId})`,
      routines: sql<number>`(select count(*) from ${routines} where ${routines.teamId} = ${teamId} and ${routines.isTemplate} = 0)`,
      planned: sql<number>`(select count(*) from ${assignments} where ${assignments.teamId} = ${teamId})`,
    }).from(teams).where(eq(teams.id, teamId)),
  ])

  const planOf = new Map(recentPlan.map(row => [`${row.athleteId} ${row.date}`, row]))
  const trained = new Set(recentLogs.map(row => `${row.athleteId} ${row.day}`))
  const dayOf = (athlete: { athleteId: number, name: string }, day: string): HomeAthleteDay => {
    const plan = planOf.get(`${athlete.athleteId} ${day}`)
    return { athleteId: athlete.athleteId, name: athlete.name, planned: plan?.planned ?? 0, done: Number(plan?.done ?? 0), trained: trained.has(`${athlete.athleteId} ${day}`) }
  }
  // An athlete with nothing planned and nothing logged on a day is left out of that day's list.
  const relevant = (entry: HomeAthleteDay) => entry.planned > 0 || entry.trained
  const groups = new Map<number | null, HomeSquadDays>()
  for (const row of rows) {
    const homes = row.squads.length ? row.squads : [{ id: null, name: 'No squad' }]
    for (const squad of homes) {
      const group = groups.get(squad.id) ?? { squadId: squad.id, squadName: squad.name, yesterday: [], today: [] }
      groups.set(squad.id, group)
      const y = dayOf(row, yesterday)
      const t = dayOf(row, today)
      if (relevant(y)) group.yesterday.push(y)
      if (relevant(t)) group.today.push(t)
    }
  }

  const c = counts[0]
  const checklist = {
    dismissed: Boolean(team?.checklistDismissedAt),
    steps: [
      { key: 'coaches', label: 'Invite your coaches', done: Number(c?.coaches ?? 0) > 1 || Number(c?.coachInvites ?? 0) > 0, to: '/team' },
      { key: 'athletes', label: 'Invite your athletes', done: Number(c?.athletes ?? 0) > 0 || Number(c?.athleteInvites ?? 0) > 0, to: '/team' },
      { key: 'squads', label: 'Make squads', done: Number(c?.squads ?? 0) > 0, to: '/team' },
      { key: 'library', label: 'Review the exercise library', done: Number(c?.exercises ?? 0) > 0, to: '/exercises' },
      { key: 'routine', label: 'Build or copy a first routine', done: Number(c?.routines ?? 0) > 0, to: '/routines' },
      { key: 'plan', label: 'Plan a first week', done: Number(c?.planned ?? 0) > 0, to: '/planner' },
    ],
  }

  return {
    today,
    yesterday,
    painFlags: flags,
    squads: [...groups.values()].filter(group => group.yesterday.length || group.today.length)
      .sort((a, b) => (a.squadId === null ? 1 : 0) - (b.squadId === null ? 1 : 0) || a.squadName.localeCompare(b.squadName)),
    upcoming: upcoming.map(row => ({ date: row.date, title: row.title, athletes: row.athletes })),
    ratios: rows.filter(row => ratioBand(row.acwrRolling) === 'low' || ratioBand(row.acwrRolling) === 'high')
      .map(row => ({ athleteId: row.athleteId, name: row.name, ratio: row.acwrRolling, band: ratioBand(row.acwrRolling) as 'low' | 'high' })),
    invites: pending,
    checklist,
  }
}

export type CoachHome = Awaited<ReturnType<typeof coachHome>>
