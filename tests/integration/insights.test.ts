import Papa from 'papaparse'
import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Database } from '../../server/db/client'
import { athleteProfiles } from '../../server/db/schema'
import { addDays, startOfWeek, todayIn } from '../../shared/utils/dates'
import { ratiosOn } from '../../shared/utils/insights'
import type { ApiClient, FieldError } from '../support/client'
import { createRoutine, insertHistory, insertPainFlag, openTestDatabase, type HistoryDay } from '../support/insights-data'
import { addAthlete, registerCoach } from '../support/team'
import type { AthleteReport, PainFlagItem, TeamInsights } from '../../types/api'
import { useStack } from '../support/hooks'

type TeamAnswer = TeamInsights
type AthleteAnswer = AthleteReport
type Flag = PainFlagItem

const running = useStack()
let db: Database
let today: string
let teamA: Awaited<ReturnType<typeof registerCoach>>
let teamB: Awaited<ReturnType<typeof registerCoach>>
let squadId: number
let otherSquadId: number
let tamsin: { athlete: ApiClient, userId: number, email: string }
let cai: { athlete: ApiClient, userId: number }
let oren: { athlete: ApiClient, userId: number }
let flagId: number

// Tamsin: an assignment on each of the last 42 days, done except every fourth day from yesterday,
// a load of 123.4 per session, squats once a week, and knee pain two days ago.
const tamsinDays: HistoryDay[] = [
  ...Array.from({ length: 42 }, (_, daysAgo): HistoryDay => ({
    daysAgo,
    done: daysAgo % 4 !== 1,
    load: 123.4,
    sessionRpe: 6,
    durationS: 1234,
    pain: daysAgo === 2 ? 6 : undefined,
    painArea: daysAgo === 2 ? 'knee' : undefined,
    note: daysAgo === 2 ? 'Knee sore on the last hill rep' : daysAgo === 7 ? '=SUM(A1) felt strong' : undefined,
    sets: daysAgo % 7 === 0 ? [{ kg: 100, reps: 5 }, { kg: 100, reps: 5 }, { kg: 100, reps: 5 }, { kg: 110, reps: 3 }] : undefined,
  })),
  { daysAgo: -1, done: false },
  { daysAgo: -2, done: false },
]

beforeAll(async () => {
  db = await openTestDatabase(running.stack.databaseUrl)
  today = todayIn('UTC')
  teamA = await registerCoach(running.stack, 'Larchford Ridge Runners')
  teamB = await registerCoach(running.stack, 'Brackenmoor Road Runners')
  squadId = (await teamA.coach.post<{ id: number }>('/api/squads', { name: 'Road squad' })).data.id
  otherSquadId = (await teamB.coach.post<{ id: number }>('/api/squads', { name: 'Fell squad' })).data.id
  tamsin = await addAthlete(running.stack, teamA.coach, { name: 'Tamsin Rook', squadId })
  cai = await addAthlete(running.stack, teamA.coach, { name: 'Cai Penhallow' })
  oren = await addAthlete(running.stack, teamB.coach, { name: 'Oren Blythe' })

  const routineA = await createRoutine(db, teamA.teamId)
  const sessions = await insertHistory(db, { teamId: teamA.teamId, athleteId: tamsin.userId, today, routine: routineA, days: tamsinDays })
  await insertHistory(db, { teamId: teamA.teamId, athleteId: cai.userId, today, routine: routineA, days: [{ daysAgo: 3, done: false }, { daysAgo: 10, done: true, load: 90 }] })
  const routineB = await createRoutine(db, teamB.teamId, 'Fell descents')
  const orenSessions = await insertHistory(db, { teamId: teamB.teamId, athleteId: oren.userId, today, routine: routineB, days: [{ daysAgo: 1, done: true, pain: 8, painArea: 'calf' }] })
  const painSession = sessions.find(session => session.day === addDays(today, -2))!
  flagId = (await insertPainFlag(db, { teamId: teamA.teamId, athleteId: tamsin.userId, sessionId: painSession.id, pain: 6, area: 'knee' })).id
  await insertPainFlag(db, { teamId: teamB.teamId, athleteId: oren.userId, sessionId: orenSessions[0]!.id, pain: 8, area: 'calf' })
})

afterAll(async () => {
  db?.$client.close()
})

function doneDays(days: HistoryDay[]) {
  return days.filter(day => day.done).map(day => ({ day: addDays(today, -day.daysAgo), load: day.load ?? 150 }))
}

describe('team table', () => {
  it('gives one row per athlete of the caller\'s team with compliance, load, ratios and flags', async () => {
    const response = await teamA.coach.get<TeamAnswer>('/api/insights/team')
    expect(response.status).toBe(200)
    expect(response.data.rows.map(row => row.name)).toEqual(['Cai Penhallow', 'Tamsin Rook'])
    const row = response.data.rows.find(r => r.athleteId === tamsin.userId)!
    // Days 0–6: misses on days 1 and 5 → 5 of 7; days 0–27: misses on 1, 5, …, 25 → 21 of 28; tomorrow not counted.
    expect(row.compliance7).toEqual({ done: 5, assigned: 7, percent: 71 })
    expect(row.compliance28).toEqual({ done: 21, assigned: 28, percent: 75 })
    expect(row.lastSession).toBe(today)
    const thisWeek = doneDays(tamsinDays).filter(day => day.day >= startOfWeek(today) && day.day <= today)
    expect(row.weekLoad).toBe(Math.round(thisWeek.length * 123.4))
    // The history starts at the first session: 41 days ago was a miss, so 40 days ago.
    const expected = ratiosOn(doneDays(tamsinDays), addDays(today, -40), today)
    expect(row.acwrRolling).toBe(expected.acwrRolling)
    expect(row.acwrEwma).toBe(expected.acwrEwma)
    expect(row.acwrRolling).toEqual(expect.any(Number))
    expect(row.openPainFlags).toBe(1)
    expect(row.squads.map(squad => squad.id)).toEqual([squadId])

    const caiRow = response.data.rows.find(r => r.athleteId === cai.userId)!
    expect(caiRow.compliance7).toEqual({ done: 0, assigned: 1, percent: 0 })
    expect(caiRow.acwrRolling).toBeNull()
  })

  it('filters by squad, sorts and pages; another team\'s squad is a 404', async () => {
    const squad = await teamA.coach.get<TeamAnswer>(`/api/insights/team?squadId=${squadId}`)
    expect(squad.data.rows.map(row => row.athleteId)).toEqual([tamsin.userId])
    const sorted = await teamA.coach.get<TeamAnswer>('/api/insights/team?sort=-weekLoad&pageSize=1&page=1')
    expect(sorted.data).toMatchObject({ total: 2, pages: 2, page: 1 })
    expect(sorted.data.rows.map(row => row.athleteId)).toEqual([tamsin.userId])
    const second = await teamA.coach.get<TeamAnswer>('/api/insights/team?sort=-weekLoad&pageSize=1&page=2')
    expect(second.data.rows.map(row => row.athleteId)).toEqual([cai.userId])
    expect((await teamA.coach.get(`/api/insights/team?squadId=${otherSquadId}`)).status).toBe(404)
    const bad = await teamA.coach.get<FieldError>('/api/insights/team?sort=shoeSize&page=0')
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.data.data?.fields ?? {})).toEqual(expect.arrayContaining(['sort', 'page']))
  })

  it('is for coaches only', async () => {
    expect((await tamsin.athlete.get('/api/insights/team')).status).toBe(403)
    const other = await teamB.coach.get<TeamAnswer>('/api/insights/team')
    expect(other.data.rows.map(row => row.athleteId)).toEqual([oren.userId])
  })
})

describe('athlete page', () => {
  it('gives weekly loads, calendar, pain, strength and notes that agree with the team row', async () => {
    const response = await teamA.coach.get<AthleteAnswer>(`/api/insights/athletes/${tamsin.userId}`)
    expect(response.status).toBe(200)
    const data = response.data
    const team = (await teamA.coach.get<TeamAnswer>('/api/insights/team')).data.rows.find(r => r.athleteId === tamsin.userId)!
    expect(data.summary).toMatchObject({ compliance7: team.compliance7, compliance28: team.compliance28, weekLoad: team.weekLoad, acwrRolling: team.acwrRolling, acwrEwma: team.acwrEwma, openPainFlags: 1 })
    expect(data.weeks).toHaveLength(12)
    expect(data.weeks.at(-1)!.weekStart).toBe(startOfWeek(today))
    const lastFull = data.weeks.at(-2)!
    const inWeek = doneDays(tamsinDays).filter(day => day.day >= lastFull.weekStart && day.day <= addDays(lastFull.weekStart, 6))
    expect(lastFull.sessions).toBe(inWeek.length)
    expect(lastFull.load).toBe(Math.round(inWeek.length * 123.4))
    // The calendar covers the whole block, in whole weeks: from the week of the first planned session
    // (41 days ago) to the end of the week of the last one (the day after tomorrow).
    expect(data.calendar[0]!.day).toBe(startOfWeek(addDays(today, -41)))
    expect(data.calendar.at(-1)!.day).toBe(addDays(startOfWeek(addDays(today, 2)), 6))
    expect(data.calendar.length % 7).toBe(0)
    const tomorrow = data.calendar.find(day => day.day === addDays(today, 1))
    if (tomorrow) expect(tomorrow.assignments).toEqual([expect.objectContaining({ done: false })])
    expect(data.calendar.find(day => day.day === today)!.assignments[0]!.done).toBe(true)
    expect(data.pain).toEqual([{ sessionId: expect.any(Number), day: addDays(today, -2), pain: 6, area: 'knee' }])
    // Epley (1985): 110 kg × 3 → 121 kg beats 100 kg × 5 → 116.7 kg; volume load 3 × 500 + 330 = 1830 kg.
    const squat = data.strength.find(trend => trend.name === 'Back squat')!
    expect(squat.points.find(point => point.day === today)).toEqual({ day: today, bestE1rmKg: 121, volumeLoadKg: 1830 })
    expect(data.notes.map(note => note.note)).toContain('Knee sore on the last hill rep')
    // 1234 s → 21 min; 123.4 → 123 units, the rounding the CSV uses too.
    expect(data.sessions[0]).toMatchObject({ day: today, durationMin: 21, load: 123, sessionRpe: 6 })
  })

  it('is the caller\'s own page for an athlete, and a 404 for anyone else\'s', async () => {
    const own = await tamsin.athlete.get<AthleteAnswer>(`/api/insights/athletes/${tamsin.userId}`)
    expect(own.status).toBe(200)
    const me = await tamsin.athlete.get<AthleteAnswer>('/api/me/insights')
    expect(me.status).toBe(200)
    expect(me.data.summary).toEqual(own.data.summary)
    expect((await tamsin.athlete.get(`/api/insights/athletes/${cai.userId}`)).status).toBe(404)
    expect((await teamA.coach.get(`/api/insights/athletes/${oren.userId}`)).status).toBe(404)
    expect((await teamB.coach.get(`/api/insights/athletes/${tamsin.userId}`)).status).toBe(404)
    expect((await teamA.coach.get(`/api/insights/athletes/${teamA.userId}`)).status).toBe(404)
    expect((await teamA.coach.get('/api/insights/athletes/999999')).status).toBe(404)
    expect((await teamA.coach.get('/api/insights/athletes/abc')).status).toBe(400)
  })
})

describe('pain flags', () => {
  it('lists open flags for the team, acknowledges with a reply the athlete sees', async () => {
    const open = await teamA.coach.get<Flag[]>('/api/pain-flags?status=open')
    expect(open.status).toBe(200)
    expect(open.data).toEqual([expect.objectContaining({ id: flagId, athleteName: 'Tamsin Rook', pain: 6, area: 'knee', status: 'open', note: 'Knee sore on the last hill rep', day: addDays(today, -2), routine: 'Hill strength circuit' })])
    expect((await tamsin.athlete.get('/api/pain-flags')).status).toBe(403)

    expect((await teamB.coach.post(`/api/pain-flags/${flagId}/acknowledge`, { reply: 'Not mine' })).status).toBe(404)
    const tooLong = await teamA.coach.post<FieldError>(`/api/pain-flags/${flagId}/acknowledge`, { reply: 'x'.repeat(1001) })
    expect(tooLong.status).toBe(400)
    expect(tooLong.data.data?.fields?.reply).toMatch(/1000/)
    expect((await teamA.coach.get<Flag[]>('/api/pain-flags?status=open')).data).toHaveLength(1)

    const reply = 'Thanks for flagging. Skip the hills this week and book in with the physio.'
    const acknowledged = await teamA.coach.post<Flag>(`/api/pain-flags/${flagId}/acknowledge`, { reply })
    expect(acknowledged.status).toBe(200)
    expect(acknowledged.data).toMatchObject({ id: flagId, status: 'acknowledged', reply })
    expect((await teamA.coach.get<Flag[]>('/api/pain-flags?status=open')).data).toEqual([])
    expect((await teamA.coach.get<Flag[]>('/api/pain-flags?status=acknowledged')).data.map(flag => flag.id)).toEqual([flagId])

    const mail = await running.stack.mail.waitFor(tamsin.email, /replied to your pain report/)
    expect(mail.text).toContain(reply)
    expect(mail.text).toContain('/progress')

    const mine = await tamsin.athlete.get<Flag[]>('/api/me/pain-flags')
    expect(mine.data).toEqual([expect.objectContaining({ id: flagId, status: 'acknowledged', reply })])
    expect((await cai.athlete.get<Flag[]>('/api/me/pain-flags')).data).toEqual([])
    const row = (await teamA.coach.get<TeamAnswer>('/api/insights/team')).data.rows.find(r => r.athleteId === tamsin.userId)!
    expect(row.openPainFlags).toBe(0)
    expect((await teamB.coach.get<Flag[]>('/api/pain-flags?status=all')).data.map(flag => flag.athleteId)).toEqual([oren.userId])
  })
})

describe('CSV export', () => {
  function parse(text: string) {
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true })
    expect(parsed.errors).toEqual([])
    return parsed.data
  }

  it('exports an athlete\'s sessions with the same numbers as the screen', async () => {
    const from = addDays(today, -41)
    const response = await teamA.coach.get<string>(`/exports/logs.csv?athleteId=${tamsin.userId}&from=${from}&to=${today}`)
    expect(response.status).toBe(200)
    expect(response.headers.get('content-type')).toMatch(/text\/csv/)
    expect(response.headers.get('content-disposition')).toMatch(/attachment; filename=".+\.csv"/)
    const rows = parse(response.text)
    expect(rows).toHaveLength(doneDays(tamsinDays).length)
    expect(new Set(rows.map(row => row.athlete))).toEqual(new Set(['Tamsin Rook']))
    const screen = (await teamA.coach.get<AthleteAnswer>(`/api/insights/athletes/${tamsin.userId}`)).data.sessions
    for (const session of screen) {
      const row = rows.find(r => Number(r.session_id) === session.id)!
      expect(row.date).toBe(session.day)
      expect(Number(row.load)).toBe(session.load)
      expect(Number(row.duration_min)).toBe(session.durationMin)
      expect(Number(row.session_rpe)).toBe(session.sessionRpe)
      expect(row.pain === '' ? null : Number(row.pain)).toBe(session.pain)
    }
    // A note that looks like a spreadsheet formula is escaped.
    expect(rows.find(row => row.date === addDays(today, -7))!.note).toBe('\'=SUM(A1) felt strong')
  })

  it('exports weekly loads and ratios identical to the athlete page', async () => {
    const page = (await teamA.coach.get<AthleteAnswer>(`/api/insights/athletes/${tamsin.userId}`)).data
    const response = await teamA.coach.get<string>(`/exports/logs.csv?kind=weeks&athleteId=${tamsin.userId}&from=${page.weeks[0]!.weekStart}&to=${today}`)
    expect(response.status).toBe(200)
    const rows = parse(response.text)
    const nullable = (value: string | undefined) => (value === '' || value === undefined ? null : Number(value))
    expect(rows.map(row => ({ weekStart: row.week_start, load: Number(row.load), sessions: Number(row.sessions), acwrRolling: nullable(row.ratio_rolling), acwrEwma: nullable(row.ratio_ewma) })))
      .toEqual(page.weeks)
  })

  it('follows the same scoping rules as the screens', async () => {
    const team = parse((await teamA.coach.get<string>('/exports/logs.csv')).text)
    expect(new Set(team.map(row => row.athlete))).toEqual(new Set(['Tamsin Rook', 'Cai Penhallow']))
    expect((await teamB.coach.get(`/exports/logs.csv?athleteId=${tamsin.userId}`)).status).toBe(404)
    expect((await tamsin.athlete.get(`/exports/logs.csv?athleteId=${cai.userId}`)).status).toBe(404)
    const own = parse((await tamsin.athlete.get<string>('/exports/logs.csv')).text)
    expect(own.length).toBeGreaterThan(0)
    expect(new Set(own.map(row => row.athlete))).toEqual(new Set(['Tamsin Rook']))
    const backwards = await teamA.coach.get<FieldError>(`/exports/logs.csv?from=${today}&to=${addDays(today, -1)}`)
    expect(backwards.status).toBe(400)
    expect(backwards.data.data?.fields?.from).toBeTruthy()
    expect((await teamA.coach.get<FieldError>('/exports/logs.csv?from=2026-02-30')).status).toBe(400)
    expect((await teamA.coach.get<FieldError>('/exports/logs.csv?from=2020-01-01&to=2026-01-01')).status).toBe(400)
  })
})

describe('paces', () => {
  it('is empty without a benchmark, then gives race equivalents and training paces with sources', async () => {
    const empty = await cai.athlete.get<{ benchmark: null, table: null }>('/api/me/paces')
    expect(empty.status).toBe(200)
    expect(empty.data).toMatchObject({ benchmark: null, table: null })

    await db.update(athleteProfiles).set({ benchmarkDistanceM: 10_000, benchmarkTimeS: 40 * 60, benchmarkDate: '2026-01-10' }).where(eq(athleteProfiles.userId, cai.userId))
    const response = await cai.athlete.get<{ table: { races: { key: string, riegel: { timeS: number, time: string, pace: { km: string, mi: string } }, danielsGilbert: { timeS: number } }[], training: { key: string }[], sources: { races: { riegel: string, danielsGilbert: string }, training: string } } }>('/api/me/paces')
    expect(response.status).toBe(200)
    const table = response.data.table
    expect(table.races.map(race => race.key)).toEqual(['1500m', 'mile', '5k', '10k', 'half', 'marathon'])
    // The benchmark distance itself comes back unchanged: 40:00 for 10 km is 4:00 /km, 6:26 /mi (1 mi = 1609.344 m).
    const tenK = table.races.find(race => race.key === '10k')!
    expect(tenK.riegel).toMatchObject({ timeS: 2400, time: '40:00', pace: { km: '4:00 /km', mi: '6:26 /mi' } })
    // Riegel (1981): 2400 · (42195/10000)^1.06 = 11,040.5 s → 3:04:00 (worked by hand).
    expect(table.races.find(race => race.key === 'marathon')!.riegel.time).toBe('3:04:00')
    expect(table.training.map(zone => zone.key)).toEqual(['easy', 'marathon', 'threshold', 'tenK', 'fiveK', 'mile'])
    expect(table.sources.races.riegel).toMatch(/Riegel \(1981\)/)
    expect(table.sources.races.danielsGilbert).toMatch(/Daniels & Gilbert \(1979\)/)
    expect((await tamsin.athlete.get<{ benchmark: null }>('/api/me/paces')).data.benchmark).toBeNull()
  })
})
