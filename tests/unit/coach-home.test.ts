import { createClient, type Client } from '@libsql/client'
import { drizzle } from 'drizzle-orm/libsql'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { migrateDatabase, type Database } from '../../server/db/client'
import * as schema from '../../server/db/schema'
import { assignments, formReviews, invites, memberships, mediaObjects, sessionLogs, squadMembers, squads, teams, users } from '../../server/db/schema'
import { COACH_HOME_STATEMENTS, coachHome } from '../../server/utils/coach-home'
import { teamInsightsRows } from '../../server/utils/insights'
import { addDays, todayIn } from '../../shared/utils/dates'
import { createRoutine, insertHistory, insertPainFlag } from '../support/insights-data'
import { openTempDatabase, type TempDatabase } from '../support/temp-database'

// The coach's home is one request that must stay "a few queries" however big the team is: the libSQL
// client under it counts every statement sent to a real SQLite file.
const MAX_STATEMENTS = 4

let temp: TempDatabase | undefined
let url: string
let db: Database
const now = new Date()
const today = todayIn('UTC', now)

/** A drizzle database over a client that counts the statements it is asked to run. */
function countingDatabase() {
  const client = createClient({ url })
  const counter = { statements: 0 }
  const counted = new Proxy(client, {
    get(target, property, receiver) {
      const value = Reflect.get(target, property, receiver)
      if (typeof value !== 'function') return value
      if (property === 'execute' || property === 'executeMultiple' || property === 'transaction') {
        return (...args: unknown[]) => {
          counter.statements += 1
          return (value as (...a: unknown[]) => unknown).apply(target, args)
        }
      }
      if (property === 'batch') {
        return (statements: unknown[], ...rest: unknown[]) => {
          counter.statements += statements.length
          return (value as (...a: unknown[]) => unknown).apply(target, [statements, ...rest])
        }
      }
      return value.bind(target)
    },
  }) as Client
  return { db: drizzle(counted, { schema }) as Database, counter, close: () => client.close() }
}

async function newTeam(name: string) {
  const [team] = await db.insert(teams).values({ name }).returning()
  const [coach] = await db.insert(users).values({ email: `${name.replaceAll(' ', '.')}@example.test`, name: 'Morwen Tay', passwordHash: 'x' }).returning()
  await db.insert(memberships).values({ teamId: team!.id, userId: coach!.id, role: 'head_coach' })
  return { teamId: team!.id, coachId: coach!.id }
}

async function addAthletes(teamId: number, names: string[], squadId?: number) {
  const people = await db.insert(users).values(names.map(name => ({ email: `${name.replaceAll(' ', '.')}.${teamId}@example.test`, name, passwordHash: 'x' }))).returning()
  await db.insert(memberships).values(people.map(person => ({ teamId, userId: person.id, role: 'athlete' as const })))
  if (squadId) await db.insert(squadMembers).values(people.map(person => ({ squadId, userId: person.id })))
  return people.map(person => person.id)
}

beforeAll(async () => {
  temp = await openTempDatabase('home')
  url = temp.url
  db = temp.db
  await migrateDatabase(db)
})

afterAll(() => {
  temp?.remove()
})

describe('the coach\'s home', () => {
  it('answers with everything in at most a few statements, however many athletes the team has', async () => {
    const { teamId, coachId } = await newTeam('Larchford Ridge Runners')
    const [road] = await db.insert(squads).values({ teamId, name: 'Road squad' }).returning()
    const [cai, ffion] = await addAthletes(teamId, ['Cai Penhallow', 'Ffion Aske'], road!.id)
    const routine = await createRoutine(db, teamId)
    // Cai: steady, trained today, missed yesterday, one session in three days. Ffion: three times the load this week.
    const caiLogs = await insertHistory(db, { teamId, athleteId: cai!, today, routine, days: [...Array.from({ length: 35 }, (_, daysAgo) => ({ daysAgo, done: daysAgo !== 1, load: 100 })), { daysAgo: -3, done: false }] })
    await insertHistory(db, { teamId, athleteId: ffion!, today, routine, days: Array.from({ length: 35 }, (_, daysAgo) => ({ daysAgo, done: true, load: daysAgo < 7 ? 300 : 100 })) })
    await insertPainFlag(db, { teamId, athleteId: cai!, sessionId: caiLogs[0]!.id, pain: 6, area: 'knee' })
    await db.insert(invites).values({ teamId, email: 'pending@example.test', role: 'athlete', tokenHash: `t-${teamId}`, invitedById: coachId, expiresAt: new Date(now.getTime() + 86_400_000) })
    // Two clips sent for review, one already answered: one is waiting.
    for (const [index, status] of (['open', 'answered'] as const).entries()) {
      const [clip] = await db.insert(mediaObjects).values({ teamId, key: `teams/${teamId}/reviews/${cai}/${index}.webm`, contentType: 'video/webm', size: 10, status: 'ready' }).returning()
      await db.insert(formReviews).values({ teamId, athleteId: cai!, clipId: clip!.id, status })
    }

    const small = countingDatabase()
    const home = await coachHome(small.db, teamId, now)
    small.close()
    expect(small.counter.statements).toBeLessThanOrEqual(MAX_STATEMENTS)
    expect(small.counter.statements).toBe(COACH_HOME_STATEMENTS)

    expect(home.today).toBe(today)
    expect(home.reviewsWaiting).toBe(1)
    expect(home.painFlags.map(flag => flag.athleteName)).toEqual(['Cai Penhallow'])
    expect(home.invites.map(invite => invite.email)).toEqual(['pending@example.test'])
    expect(home.upcoming).toEqual([{ date: addDays(today, 3), title: 'Hill strength circuit', athletes: 1 }])
    const group = home.squads.find(squad => squad.squadName === 'Road squad')!
    expect(group.yesterday).toEqual([expect.objectContaining({ name: 'Cai Penhallow', planned: 1, done: 0, trained: false }), expect.objectContaining({ name: 'Ffion Aske', planned: 1, done: 1, trained: true })])
    expect(group.today.map(entry => [entry.name, entry.trained])).toEqual([['Cai Penhallow', true], ['Ffion Aske', true]])
    // The ratio list agrees with the insights table, which computes its rows its own way.
    const insightRows = await teamInsightsRows(db, teamId, undefined, now)
    expect(home.ratios).toEqual(insightRows.filter(row => row.acwrRolling !== null && (row.acwrRolling < 0.8 || row.acwrRolling > 1.3))
      .map(row => ({ athleteId: row.athleteId, name: row.name, ratio: row.acwrRolling, band: row.acwrRolling! > 1.3 ? 'high' : 'low' })))
    expect(home.ratios.map(row => row.name)).toEqual(['Ffion Aske'])
    expect(home.checklist.steps.filter(step => step.done).map(step => step.key)).toEqual(['athletes', 'squads', 'library', 'routine', 'plan'])

    // Eighty more athletes, each with a fortnight of history: still the same statements.
    const more = await addAthletes(teamId, Array.from({ length: 80 }, (_, index) => `Runner ${String(index + 1).padStart(2, '0')}`), road!.id)
    // Written in two statements (one per table) so that the seeding stays quick on a busy machine.
    const planned = await db.insert(assignments).values(more.flatMap(athleteId => Array.from({ length: 14 }, (_, daysAgo) => ({
      teamId, athleteId, routineId: routine.routineId, routineVersion: 1, snapshot: routine.snapshot, date: addDays(today, -daysAgo), status: daysAgo % 2 === 0 ? 'done' as const : 'planned' as const,
    })))).returning({ id: assignments.id, athleteId: assignments.athleteId, date: assignments.date, status: assignments.status })
    await db.insert(sessionLogs).values(planned.filter(row => row.status === 'done').map(row => ({
      teamId, assignmentId: row.id, athleteId: row.athleteId, clientId: `bulk-${row.id}`, startedAt: new Date(`${row.date}T07:00:00Z`), finishedAt: new Date(`${row.date}T07:30:00Z`), day: row.date, durationS: 1800, sessionRpe: 4, load: 120,
    })))
    const big = countingDatabase()
    const bigHome = await coachHome(big.db, teamId, now)
    big.close()
    expect(big.counter.statements).toBe(small.counter.statements)
    expect(bigHome.squads.find(squad => squad.squadName === 'Road squad')!.today).toHaveLength(82)
  }, 60_000)

  it('shows another team nothing of this one', async () => {
    const { teamId } = await newTeam('Quiet Club')
    const home = await coachHome(db, teamId, now)
    expect(home.painFlags).toEqual([])
    expect(home.squads).toEqual([])
    expect(home.upcoming).toEqual([])
    expect(home.invites).toEqual([])
    expect(home.reviewsWaiting).toBe(0)
    expect(home.checklist.steps.every(step => !step.done)).toBe(true)
  })
})
