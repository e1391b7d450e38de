import ICAL from 'ical.js'
import { describe, expect, it } from 'vitest'
import { ApiClient, type FieldError } from '../support/client'
import { countRows, hillSteps, insertExercise, insertRoutine, outboxSettled } from '../support/planner'
import { addAthlete, addSquad, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'
import type { AssignmentsCreated, MyAssignments, PlannedAssignments } from '../../types/api'

const running = useStack()

async function squadTeam(athleteCount = 2) {
  const team = await registerCoach(running.stack, 'Larchford Ridge Runners')
  const { squadId, athletes } = await addSquad(running.stack, team.coach, { name: 'Ridge group', count: athleteCount, athleteName: 'Ridge Runner' })
  const exerciseId = await insertExercise(running.db, team.teamId, { name: 'Uphill drive', cautions: [{ text: 'Ease off if the Achilles tightens', bodyAreas: ['achilles'] }] })
  const routineId = await insertRoutine(running.db, team.teamId, { title: 'Ridge road hill reps', steps: hillSteps(exerciseId) })
  return { ...team, squadId, athletes, exerciseId, routineId }
}

async function snapshotOf(id: number) {
  const result = await running.db.execute({ sql: 'select snapshot, routine_version from assignments where id = ?', args: [id] })
  return { snapshot: JSON.parse(String(result.rows[0]!.snapshot)), version: Number(result.rows[0]!.routine_version) }
}

describe('assigning a weekly series', () => {
  it('computes dates across a month end and the UK spring clock change, for every squad athlete', async () => {
    const team = await squadTeam()
    const response = await team.coach.post<AssignmentsCreated>('/api/assignments', {
      routineId: team.routineId,
      squadId: team.squadId,
      series: { startDate: '2027-03-22', weeks: 2, weekdays: [7, 2] },
      note: 'Keep the descents easy.',
    })
    expect(response.status).toBe(201)
    const expected = ['2027-03-23', '2027-03-28', '2027-03-30', '2027-04-04']
    expect(response.data.dates).toEqual(expected)
    expect(response.data.created).toBe(expected.length * 2)
    expect(response.data.seriesId).toBeTypeOf('number')

    const list = await team.coach.get<PlannedAssignments>(`/api/assignments?from=2027-03-01&to=2027-04-30&squadId=${team.squadId}`)
    expect(list.status).toBe(200)
    for (const athlete of team.athletes) {
      const mine = list.data.assignments.filter(row => row.athleteId === athlete.userId)
      expect(mine.map(row => row.date)).toEqual(expected)
      expect(mine.every(row => row.title === 'Ridge road hill reps' && row.category === 'hills' && row.shownStatus === 'planned' && row.seriesId === response.data.seriesId)).toBe(true)
    }
  })

  it('crosses the autumn changes in London and New York without moving a day', async () => {
    const team = await squadTeam(1)
    await running.db.execute({ sql: 'update users set timezone = ? where id = ?', args: ['America/New_York', team.athletes[0]!.userId] })
    const response = await team.coach.post<AssignmentsCreated>('/api/assignments', {
      routineId: team.routineId,
      athleteIds: [team.athletes[0]!.userId],
      series: { startDate: '2027-10-25', weeks: 3, weekdays: [7, 1] },
    })
    expect(response.status).toBe(201)
    // 31 Oct 2027 is the UK change, 7 Nov 2027 the US one; both Sundays stay Sundays.
    expect(response.data.dates).toEqual(['2027-10-25', '2027-10-31', '2027-11-01', '2027-11-07', '2027-11-08', '2027-11-14'])
    const mine = await team.athletes[0]!.athlete.get<MyAssignments>('/api/me/assignments?from=2027-10-01&to=2027-11-30')
    expect(mine.data.assignments.map(row => row.date)).toEqual(response.data.dates)
  })

  it('sends each athlete exactly one notice per batch, listing the dates', async () => {
    const team = await squadTeam()
    const response = await team.coach.post<AssignmentsCreated>('/api/assignments', {
      routineId: team.routineId,
      squadId: team.squadId,
      series: { startDate: '2027-02-22', weeks: 2, weekdays: [2, 5] },
      note: 'Bring gloves.',
      athleteNotes: { [team.athletes[0]!.userId]: 'Only six reps this time.' },
    })
    expect(response.status).toBe(201)
    const [first, second] = team.athletes
    const mail = await running.stack.mail.waitFor(first!.email, /Planned for you/)
    await outboxSettled(running.db)
    expect(running.stack.mail.to(first!.email).filter(message => /Planned for you/.test(message.subject ?? ''))).toHaveLength(1)
    expect(running.stack.mail.to(second!.email).filter(message => /Planned for you/.test(message.subject ?? ''))).toHaveLength(1)
    expect(mail.subject).toContain('Ridge road hill reps')
    expect(mail.text).toContain('4 sessions')
    for (const day of ['Tue 23 Feb 2027', 'Fri 26 Feb 2027', 'Tue 2 Mar 2027', 'Fri 5 Mar 2027']) expect(mail.text).toContain(day)
    expect(mail.text).toContain('Only six reps this time.')
    const secondMail = running.stack.mail.to(second!.email).find(message => /Planned for you/.test(message.subject ?? ''))!
    expect(secondMail.text).toContain('Bring gloves.')
    expect(secondMail.text).not.toContain('Only six reps')

    const mine = await first!.athlete.get<MyAssignments>('/api/me/assignments?from=2027-02-01&to=2027-03-31')
    expect(mine.data.assignments[0]!.note).toBe('Bring gloves.\n\nOnly six reps this time.')
  })

  it('respects an athlete who turned notices off', async () => {
    const team = await squadTeam()
    const [quiet, loud] = team.athletes
    expect((await quiet!.athlete.get<{ notifyByEmail: boolean }>('/api/me/notifications')).data.notifyByEmail).toBe(true)
    const off = await quiet!.athlete.patch<{ notifyByEmail: boolean }>('/api/me/notifications', { notifyByEmail: false })
    expect(off.status).toBe(200)
    expect((await quiet!.athlete.get<{ notifyByEmail: boolean }>('/api/me/notifications')).data.notifyByEmail).toBe(false)
    const bad = await quiet!.athlete.patch<FieldError>('/api/me/notifications', { notifyByEmail: 'sometimes' })
    expect(bad.status).toBe(400)
    expect(bad.data.data?.fields?.notifyByEmail).toBeTruthy()

    expect((await team.coach.post('/api/assignments', { routineId: team.routineId, squadId: team.squadId, dates: ['2027-01-12'] })).status).toBe(201)
    await running.stack.mail.waitFor(loud!.email, /Planned for you/)
    await outboxSettled(running.db)
    expect(running.stack.mail.to(quiet!.email).filter(message => /Planned for you/.test(message.subject ?? ''))).toHaveLength(0)
    const queued = await running.db.execute({ sql: 'select count(*) as n from email_outbox where "to" = ? and template = ?', args: [quiet!.email, 'assignments_created'] })
    expect(Number(queued.rows[0]!.n)).toBe(0)
  })
})

describe('snapshots', () => {
  it('keep what was assigned when the routine and its exercises change; refresh updates only future planned ones', async () => {
    const team = await squadTeam(1)
    const athlete = team.athletes[0]!
    const response = await team.coach.post<AssignmentsCreated>('/api/assignments', {
      routineId: team.routineId,
      athleteIds: [athlete.userId],
      dates: ['2027-02-08', '2026-11-20', '2027-02-01'],
    })
    expect(response.status).toBe(201)
    expect(response.data.dates).toEqual(['2026-11-20', '2027-02-01', '2027-02-08'])

    const before = await snapshotOf(response.data.ids[0]!)
    expect(before.snapshot).toMatchObject({ title: 'Ridge road hill reps', category: 'hills', exercises: [{ id: team.exerciseId, name: 'Uphill drive', cues: ['Lean from the ankles'], cautions: [{ text: 'Ease off if the Achilles tightens' }] }] })
    expect(before.snapshot.steps[1].times).toBe(8)

    // The builder saves a new version; the library renames the exercise.
    await running.db.execute({ sql: 'update routines set title = ?, steps = ?, version = 2 where id = ?', args: ['Ridge road hill reps (longer)', JSON.stringify(hillSteps(team.exerciseId, 10)), team.routineId] })
    await running.db.execute({ sql: 'update exercises set name = ? where id = ?', args: ['Uphill power drive', team.exerciseId] })

    for (const id of response.data.ids) {
      const { snapshot, version } = await snapshotOf(id)
      expect(snapshot.title).toBe('Ridge road hill reps')
      expect(snapshot.steps[1].times).toBe(8)
      expect(snapshot.exercises[0].name).toBe('Uphill drive')
      expect(version).toBe(1)
    }
    const listed = await team.coach.get<PlannedAssignments>(`/api/assignments?from=2026-11-01&to=2027-02-28&athleteId=${athlete.userId}`)
    expect(listed.data.assignments.map(row => [row.title, row.routineVersion, row.latestVersion])).toEqual([
      ['Ridge road hill reps', 1, 2], ['Ridge road hill reps', 1, 2], ['Ridge road hill reps', 1, 2],
    ])
    // 20 Nov 2026 has passed and was never done.
    expect(listed.data.assignments.map(row => row.shownStatus)).toEqual(['overdue', 'planned', 'planned'])

    const refreshed = await team.coach.post<{ updated: number, version: number }>('/api/assignments/refresh-routine', { routineId: team.routineId })
    expect(refreshed.status).toBe(200)
    expect(refreshed.data).toEqual({ updated: 2, version: 2 })
    const [past, ...future] = await Promise.all(response.data.ids.map(snapshotOf))
    expect(past!.snapshot.title).toBe('Ridge road hill reps')
    for (const row of future) {
      expect(row.version).toBe(2)
      expect(row.snapshot.title).toBe('Ridge road hill reps (longer)')
      expect(row.snapshot.steps[1].times).toBe(10)
      expect(row.snapshot.exercises[0].name).toBe('Uphill power drive')
    }
  })

  it('derives overdue from the athlete\'s own calendar day', async () => {
    const team = await squadTeam(2)
    const [east, west] = team.athletes
    await running.db.execute({ sql: 'update users set timezone = ? where id = ?', args: ['Pacific/Kiritimati', east!.userId] })
    await running.db.execute({ sql: 'update users set timezone = ? where id = ?', args: ['Pacific/Pago_Pago', west!.userId] })
    // Pago Pago (UTC−11) is always a day or more behind Kiritimati (UTC+14): its today has already passed there.
    const westToday = new Intl.DateTimeFormat('en-CA', { timeZone: 'Pacific/Pago_Pago' }).format(new Date())
    expect((await team.coach.post('/api/assignments', { routineId: team.routineId, squadId: team.squadId, dates: [westToday] })).status).toBe(201)
    const eastMine = await east!.athlete.get<MyAssignments>(`/api/me/assignments?from=${westToday}&to=${westToday}`)
    const westMine = await west!.athlete.get<MyAssignments>(`/api/me/assignments?from=${westToday}&to=${westToday}`)
    expect(eastMine.data.assignments[0]!.shownStatus).toBe('overdue')
    expect(westMine.data.assignments[0]!.shownStatus).toBe('planned')
    expect(westMine.data.today).toBe(westToday)
    expect(eastMine.data.today > westToday).toBe(true)
  })

  it('returns the last days too when asked for missed sessions, and refuses more than 14', async () => {
    const team = await squadTeam(1)
    const [me] = team.athletes
    const today = new Intl.DateTimeFormat('en-CA', { timeZone: 'UTC' }).format(new Date())
    const back = (days: number) => new Date(Date.parse(`${today}T00:00:00Z`) - days * 86_400_000).toISOString().slice(0, 10)
    expect((await team.coach.post('/api/assignments', { routineId: team.routineId, athleteIds: [me!.userId], dates: [back(10), back(3), today] })).status).toBe(201)
    const plain = await me!.athlete.get<MyAssignments>('/api/me/assignments')
    expect(plain.data.assignments.map(row => row.date)).toEqual([today])
    const withMissed = await me!.athlete.get<MyAssignments>('/api/me/assignments?missedDays=7')
    expect(withMissed.data.assignments.map(row => [row.date, row.shownStatus])).toEqual([[back(3), 'overdue'], [today, 'planned']])
    const tooFar = await me!.athlete.get<{ data: { fields: Record<string, string> } }>('/api/me/assignments?missedDays=30')
    expect(tooFar.status).toBe(400)
    expect(tooFar.data.data.fields.missedDays).toMatch(/At most 14/)
  })
})

describe('calendar feed', () => {
  it('serves the athlete\'s own assignments as all-day iCalendar events with stable UIDs, and stops when regenerated', async () => {
    const team = await squadTeam(2)
    const [me, other] = team.athletes
    const mine = await team.coach.post<AssignmentsCreated>('/api/assignments', { routineId: team.routineId, athleteIds: [me!.userId], series: { startDate: '2027-03-22', weeks: 2, weekdays: [7] }, note: 'Sunday hills' })
    const theirs = await team.coach.post<AssignmentsCreated>('/api/assignments', { routineId: team.routineId, athleteIds: [other!.userId], dates: ['2027-03-24'] })
    expect(mine.status).toBe(201)
    expect(theirs.status).toBe(201)

    expect((await me!.athlete.get<{ active: boolean }>('/api/me/calendar-feed')).data.active).toBe(false)
    const feed = await me!.athlete.post<{ url: string }>('/api/me/calendar-feed')
    expect(feed.status).toBe(201)
    const token = feed.data.url.match(/\/calendar\/([\w-]+)\.ics$/)![1]!
    expect(token.length).toBeGreaterThanOrEqual(40)
    const stored = await running.db.execute({ sql: 'select token_hash from calendar_feeds where user_id = ?', args: [me!.userId] })
    expect(stored.rows.map(row => row.token_hash)).not.toContain(token)
    expect((await me!.athlete.get<{ active: boolean }>('/api/me/calendar-feed')).data.active).toBe(true)

    const first = await fetch(feed.data.url)
    expect(first.status).toBe(200)
    expect(first.headers.get('content-type')).toMatch(/^text\/calendar/)
    const text = await first.text()
    const calendar = new ICAL.Component(ICAL.parse(text) as unknown[])
    const events = calendar.getAllSubcomponents('vevent').map(component => new ICAL.Event(component))
    expect(events.map(event => event.startDate.toString())).toEqual(['2027-03-28', '2027-04-04'])
    expect(events.every(event => event.startDate.isDate && event.endDate.isDate)).toBe(true)
    expect(events.map(event => event.endDate.toString())).toEqual(['2027-03-29', '2027-04-05'])
    expect(events.every(event => event.summary === 'Ridge road hill reps')).toBe(true)
    expect(events[0]!.description).toContain('Sunday hills')
    expect(events[0]!.description).toContain(`/session/${mine.data.ids[0]}`)
    expect(text).not.toContain(`assignment-${theirs.data.ids[0]}@`)
    expect(text).not.toContain('Ridge Runner 2')

    const again = await (await fetch(feed.data.url)).text()
    const againUids = new ICAL.Component(ICAL.parse(again) as unknown[]).getAllSubcomponents('vevent').map(component => component.getFirstPropertyValue('uid'))
    expect(againUids).toEqual(events.map(event => event.uid))
    expect(new Set(againUids).size).toBe(2)

    const renewed = await me!.athlete.post<{ url: string }>('/api/me/calendar-feed')
    expect(renewed.data.url).not.toBe(feed.data.url)
    expect((await fetch(feed.data.url)).status).toBe(404)
    expect((await fetch(renewed.data.url)).status).toBe(200)
    expect((await fetch(`${running.stack.url}/calendar/${'x'.repeat(43)}.ics`)).status).toBe(404)

    expect((await me!.athlete.delete('/api/me/calendar-feed')).status).toBe(204)
    expect((await fetch(renewed.data.url)).status).toBe(404)
  })
})

describe('moving and removing', () => {
  it('moves by date, removes one, the rest of a series for one athlete or all, and keeps logged sessions', async () => {
    const team = await squadTeam(2)
    const [a, b] = team.athletes
    const created = await team.coach.post<AssignmentsCreated>('/api/assignments', { routineId: team.routineId, squadId: team.squadId, series: { startDate: '2027-05-03', weeks: 3, weekdays: [1, 4] } })
    expect(created.status).toBe(201)
    const list = async () => (await team.coach.get<PlannedAssignments>(`/api/assignments?from=2027-05-01&to=2027-05-31&squadId=${team.squadId}`)).data.assignments
    const rowsOf = async (userId: number) => (await list()).filter(row => row.athleteId === userId)

    const aRows = await rowsOf(a!.userId)
    expect(aRows.map(row => row.date)).toEqual(['2027-05-03', '2027-05-06', '2027-05-10', '2027-05-13', '2027-05-17', '2027-05-20'])
    const moved = await team.coach.patch<{ date: string }>(`/api/assignments/${aRows[0]!.id}`, { date: '2027-05-04', note: 'Moved for the club race' })
    expect(moved.status).toBe(200)
    expect((await rowsOf(a!.userId))[0]).toMatchObject({ id: aRows[0]!.id, date: '2027-05-04', note: 'Moved for the club race' })

    const badMove = await team.coach.patch<FieldError>(`/api/assignments/${aRows[0]!.id}`, { date: '2027-02-29' })
    expect(badMove.status).toBe(400)
    expect(badMove.data.data?.fields?.date).toMatch(/real date/)

    // A logged session can't be moved or removed.
    await running.db.execute({ sql: 'update assignments set status = ? where id = ?', args: ['done', aRows[1]!.id] })
    await running.db.execute({ sql: 'insert into session_logs (team_id, assignment_id, athlete_id, client_id, started_at, day) values (?, ?, ?, ?, ?, ?)', args: [team.teamId, aRows[1]!.id, a!.userId, 'client-1', Date.now(), '2027-05-06'] })
    expect((await team.coach.patch(`/api/assignments/${aRows[1]!.id}`, { date: '2027-05-07' })).status).toBe(409)
    expect((await team.coach.delete(`/api/assignments/${aRows[1]!.id}`)).status).toBe(409)

    expect((await team.coach.delete(`/api/assignments/${aRows[2]!.id}`)).status).toBe(204)
    expect((await team.coach.patch(`/api/assignments/${aRows[2]!.id}`, { note: 'gone' })).status).toBe(404)

    // From 13 May on, only athlete A.
    const restA = await team.coach.delete<{ removed: number }>(`/api/assignments/${aRows[3]!.id}/rest-of-series`)
    expect(restA.data.removed).toBe(3)
    expect((await rowsOf(a!.userId)).map(row => row.date)).toEqual(['2027-05-04', '2027-05-06'])
    expect(await rowsOf(b!.userId)).toHaveLength(6)

    // From B's 17 May on, everyone (A has nothing left there).
    const bRows = await rowsOf(b!.userId)
    const restAll = await team.coach.delete<{ removed: number }>(`/api/assignments/${bRows[4]!.id}/rest-of-series?who=all`)
    expect(restAll.data.removed).toBe(2)
    expect((await rowsOf(b!.userId)).map(row => row.date)).toEqual(['2027-05-03', '2027-05-06', '2027-05-10', '2027-05-13'])

    const single = await team.coach.post<AssignmentsCreated>('/api/assignments', { routineId: team.routineId, athleteIds: [a!.userId], dates: ['2027-05-25'] })
    expect((await team.coach.delete<FieldError>(`/api/assignments/${single.data.ids[0]}/rest-of-series`)).status).toBe(400)
  })

  it('adds athletes who joined the squad later to the rest of the series, once', async () => {
    const team = await squadTeam(1)
    const created = await team.coach.post<AssignmentsCreated>('/api/assignments', { routineId: team.routineId, squadId: team.squadId, series: { startDate: '2027-06-07', weeks: 2, weekdays: [3] } })
    expect(created.data.created).toBe(2)
    // The routine moves on after the series was made; the newcomer gets what the squad has.
    await running.db.execute({ sql: 'update routines set title = ?, version = 2 where id = ?', args: ['Something else entirely', team.routineId] })

    const newcomer = await addAthlete(running.stack, team.coach, { squadId: team.squadId, name: 'Late Joiner' })
    const synced = await team.coach.post<{ added: number, created: number, athleteIds: number[] }>(`/api/assignments/series/${created.data.seriesId}/sync-squad`)
    expect(synced.status).toBe(200)
    expect(synced.data).toMatchObject({ added: 1, created: 2, athleteIds: [newcomer.userId] })
    const theirs = await newcomer.athlete.get<MyAssignments>('/api/me/assignments?from=2027-06-01&to=2027-06-30')
    expect(theirs.data.assignments.map(row => [row.date, row.title])).toEqual([['2027-06-09', 'Ridge road hill reps'], ['2027-06-16', 'Ridge road hill reps']])
    await running.stack.mail.waitFor(newcomer.email, /Planned for you/)

    const again = await team.coach.post<{ added: number }>(`/api/assignments/series/${created.data.seriesId}/sync-squad`)
    expect(again.data.added).toBe(0)

    const direct = await team.coach.post<AssignmentsCreated>('/api/assignments', { routineId: team.routineId, athleteIds: [newcomer.userId], series: { startDate: '2027-06-07', weeks: 1, weekdays: [1] } })
    expect((await team.coach.post<FieldError>(`/api/assignments/series/${direct.data.seriesId}/sync-squad`)).status).toBe(400)
  })
})

describe('scoping', () => {
  it('keeps teams and athletes apart: another team\'s ids are 404, athletes cannot plan, signed out is 401', async () => {
    const ours = await squadTeam(2)
    const theirs = await squadTeam(1)
    const created = await ours.coach.post<AssignmentsCreated>('/api/assignments', { routineId: ours.routineId, squadId: ours.squadId, series: { startDate: '2027-04-05', weeks: 1, weekdays: [2] } })
    const id = created.data.ids[0]!

    expect((await theirs.coach.patch(`/api/assignments/${id}`, { date: '2027-04-07' })).status).toBe(404)
    expect((await theirs.coach.delete(`/api/assignments/${id}`)).status).toBe(404)
    expect((await theirs.coach.delete(`/api/assignments/${id}/rest-of-series`)).status).toBe(404)
    expect((await theirs.coach.post(`/api/assignments/series/${created.data.seriesId}/sync-squad`)).status).toBe(404)
    expect((await theirs.coach.post('/api/assignments', { routineId: ours.routineId, athleteIds: [theirs.athletes[0]!.userId], dates: ['2027-04-06'] })).status).toBe(404)
    expect((await theirs.coach.post('/api/assignments/refresh-routine', { routineId: ours.routineId })).status).toBe(404)
    expect((await theirs.coach.post('/api/assignments', { routineId: theirs.routineId, squadId: ours.squadId, dates: ['2027-04-06'] })).status).toBe(404)
    const foreignAthlete = await theirs.coach.post<FieldError>('/api/assignments', { routineId: theirs.routineId, athleteIds: [ours.athletes[0]!.userId], dates: ['2027-04-06'] })
    expect(foreignAthlete.status).toBe(400)
    expect(foreignAthlete.data.data?.fields?.athleteIds).toMatch(/not in your team/)
    expect((await theirs.coach.get(`/api/assignments?from=2027-04-01&to=2027-04-30&athleteId=${ours.athletes[0]!.userId}`)).status).toBe(404)
    expect((await theirs.coach.get(`/api/assignments?from=2027-04-01&to=2027-04-30&squadId=${ours.squadId}`)).status).toBe(404)
    const theirList = await theirs.coach.get<PlannedAssignments>('/api/assignments?from=2027-04-01&to=2027-04-30')
    expect(theirList.data.assignments).toEqual([])

    const athlete = ours.athletes[0]!.athlete
    expect((await athlete.post('/api/assignments', { routineId: ours.routineId, athleteIds: [ours.athletes[0]!.userId], dates: ['2027-04-06'] })).status).toBe(403)
    expect((await athlete.get('/api/assignments?from=2027-04-01&to=2027-04-30')).status).toBe(403)
    expect((await athlete.delete(`/api/assignments/${id}`)).status).toBe(403)
    const own = await athlete.get<MyAssignments>('/api/me/assignments?from=2027-04-01&to=2027-04-30')
    expect(own.data.assignments).toHaveLength(1)
    expect(created.data.ids).toContain(own.data.assignments[0]!.id)
    const mineIds = own.data.assignments.map(row => row.id)
    const otherOwn = await ours.athletes[1]!.athlete.get<MyAssignments>('/api/me/assignments?from=2027-04-01&to=2027-04-30')
    expect(otherOwn.data.assignments.map(row => row.id).some(rowId => mineIds.includes(rowId))).toBe(false)

    const stranger = new ApiClient(running.stack.url)
    expect((await stranger.get('/api/me/assignments')).status).toBe(401)
    expect((await stranger.post('/api/me/calendar-feed')).status).toBe(401)
    expect((await stranger.get('/api/assignments?from=2027-04-01&to=2027-04-30')).status).toBe(401)
  })
})

describe('bad input', () => {
  it('answers with field messages and writes nothing', async () => {
    const team = await squadTeam(1)
    const athleteIds = [team.athletes[0]!.userId]
    const archived = await insertRoutine(running.db, team.teamId, { title: 'Old hill session', archived: true })
    const before = await Promise.all([countRows(running.db, 'assignments', team.teamId), countRows(running.db, 'assignment_series', team.teamId), countRows(running.db, 'email_outbox', team.teamId)])

    const cases: [unknown, string, RegExp][] = [
      [{ routineId: team.routineId, athleteIds, series: { startDate: '2027-01-04', weeks: 27, weekdays: [2] } }, 'series.weeks', /at most 26 weeks/],
      [{ routineId: team.routineId, athleteIds, series: { startDate: '2027-01-04', weeks: 4, weekdays: [] } }, 'series.weekdays', /at least one weekday/],
      [{ routineId: team.routineId, athleteIds, series: { startDate: '2027-01-04', weeks: 4, weekdays: [8] } }, 'series.weekdays.0', /1 \(Monday\) to 7/],
      [{ routineId: team.routineId, athleteIds, series: { startDate: '2027-02-29', weeks: 4, weekdays: [2] } }, 'series.startDate', /real date/],
      [{ routineId: team.routineId, athleteIds, dates: ['2027-04-31'] }, 'dates.0', /real date/],
      [{ routineId: team.routineId, athleteIds, dates: ['next tuesday'] }, 'dates.0', /2026-03-15/],
      [{ routineId: team.routineId, athleteIds, dates: ['2027-01-04', '2027-07-05'] }, 'dates', /more than 26 weeks/],
      [{ routineId: team.routineId, athleteIds, dates: [] }, 'dates', /at least one date/],
      [{ routineId: team.routineId, athleteIds }, 'dates', /dates or a weekly repeat/],
      [{ routineId: team.routineId, athleteIds, dates: ['2027-01-05'], series: { startDate: '2027-01-04', weeks: 1, weekdays: [2] } }, 'series', /not both/],
      [{ routineId: team.routineId, dates: ['2027-01-05'] }, 'athleteIds', /athletes or a squad/],
      [{ routineId: archived, athleteIds, dates: ['2027-01-05'] }, 'routineId', /archived/],
      [{ routineId: 'hills', athleteIds, dates: ['2027-01-05'] }, 'routineId', /./],
      [{ routineId: team.routineId, athleteIds, dates: ['2027-01-05'], athleteNotes: { 999999: 'hi' } }, 'athleteNotes.999999', /not in the batch/],
      [{ routineId: team.routineId, athleteIds, dates: ['2027-01-05'], note: 'x'.repeat(1001) }, 'note', /at most 1000/],
    ]
    for (const [body, field, message] of cases) {
      const response = await team.coach.post<FieldError>('/api/assignments', body)
      expect(response.status, JSON.stringify(body).slice(0, 120)).toBe(400)
      expect(response.data.data?.fields?.[field], `${field} in ${response.text}`).toMatch(message)
      expect(response.text).not.toMatch(/at .*\.mjs:\d+/)
    }
    const malformed = await team.coach.request<FieldError>('POST', '/api/assignments', undefined, { raw: '{"routineId": 1,' })
    expect(malformed.status).toBe(400)

    const longRange = await team.coach.get<FieldError>('/api/assignments?from=2027-01-01&to=2027-12-31')
    expect(longRange.status).toBe(400)
    expect(longRange.data.data?.fields?.to).toMatch(/at most 26 weeks/)
    const backwards = await team.coach.get<FieldError>('/api/assignments?from=2027-02-01&to=2027-01-01')
    expect(backwards.data.data?.fields?.to).toMatch(/before the start/)
    expect((await team.coach.get<FieldError>('/api/assignments?from=2027-02-30&to=2027-03-01')).status).toBe(400)
    expect((await team.coach.patch<FieldError>('/api/assignments/1', {})).status).toBe(400)
    expect((await team.coach.post<FieldError>('/api/assignments/refresh-routine', { routineId: archived })).status).toBe(400)

    const after = await Promise.all([countRows(running.db, 'assignments', team.teamId), countRows(running.db, 'assignment_series', team.teamId), countRows(running.db, 'email_outbox', team.teamId)])
    expect(after).toEqual(before)
  })

  it('creates a batch all or nothing when a write fails part-way', async () => {
    const team = await squadTeam(2)
    const before = await Promise.all([countRows(running.db, 'assignments', team.teamId), countRows(running.db, 'assignment_series', team.teamId), countRows(running.db, 'email_outbox', team.teamId)])
    // A storage failure on the last day of the second athlete's block, after the other rows were written.
    await running.db.execute(`create trigger fail_one_assignment before insert on assignments when new.date = '2027-08-27' and new.athlete_id = ${team.athletes[1]!.userId} begin select raise(abort, 'disk trouble'); end`)
    try {
      const response = await team.coach.post('/api/assignments', { routineId: team.routineId, squadId: team.squadId, series: { startDate: '2027-08-02', weeks: 4, weekdays: [2, 5] } })
      expect(response.status).toBeGreaterThanOrEqual(500)
      expect(response.text).not.toMatch(/at .*\.mjs:\d+/)
    }
    finally {
      await running.db.execute('drop trigger fail_one_assignment')
    }
    const after = await Promise.all([countRows(running.db, 'assignments', team.teamId), countRows(running.db, 'assignment_series', team.teamId), countRows(running.db, 'email_outbox', team.teamId)])
    expect(after).toEqual(before)

    const retry = await team.coach.post<AssignmentsCreated>('/api/assignments', { routineId: team.routineId, squadId: team.squadId, series: { startDate: '2027-08-02', weeks: 4, weekdays: [2, 5] } })
    expect(retry.status).toBe(201)
    expect(retry.data.created).toBe(16)
  })
})
