import ICAL from 'ical.js'
import { describe, expect, it } from 'vitest'
import { ApiClient, type FieldError } from '../support/client'
import { countRows, hillSteps, insertExercise, insertRoutine, outboxSettled } from '../support/planner'
import { addSquad, registerCoach } from '../support/team'
import { addDays } from '../../shared/utils/dates'
import { useStack } from '../support/hooks'

// Progressions, lighter weeks and the taper are common coaching practice (no published source);
// the numbers below are the rules' arithmetic, worked out by hand beside each check.

const running = useStack()

const utcToday = () => new Date().toISOString().slice(0, 10)

function gymSteps(exerciseId: number) {
  return [
    { id: 'squat', type: 'sets', exerciseId, sets: 3, perSet: { by: 'reps', reps: 8 }, restSeconds: 90, target: { type: 'load', kg: 40 } },
  ]
}

async function blockTeam(athleteCount = 2) {
  const team = await registerCoach(running.stack, 'Larchford Ridge Runners')
  const { squadId, athletes } = await addSquad(running.stack, team.coach, { name: 'Road group', count: athleteCount, athleteName: 'Road Runner' })
  const hillId = await insertExercise(running.db, team.teamId, { name: 'Uphill drive' })
  const squatId = await insertExercise(running.db, team.teamId, { name: 'Goblet squat', category: 'strength' })
  const hills = await insertRoutine(running.db, team.teamId, { title: 'Ridge road hill reps', steps: hillSteps(hillId, 6) })
  const gym = await insertRoutine(running.db, team.teamId, { title: 'Club gym squats', category: 'strength', steps: gymSteps(squatId) })
  return { ...team, squadId, athletes, hills, gym }
}

function hillBlock(team: Awaited<ReturnType<typeof blockTeam>>, overrides: Record<string, unknown> = {}) {
  return {
    name: 'Spring hills',
    startDate: '2027-03-01',
    weeks: 8,
    squadIds: [team.squadId],
    lighter: { weeks: [4], factor: 0.6 },
    taper: { weeks: 1, factor: 0.6 },
    goalRace: { name: 'Larchford Ridge 10', date: '2027-04-25', distanceM: 10_000 },
    note: 'Keep the easy days easy.',
    routines: [
      { routineId: team.hills, weekday: 2, rules: [{ stepId: 'reps', field: 'rounds', by: 1, cap: 10 }] },
      { routineId: team.gym, weekday: 4, rules: [{ stepId: 'squat', field: 'loadKg', by: 2 }] },
    ],
    ...overrides,
  }
}

interface SnapshotRow { id: number, athleteId: number, date: string, week: number, routineId: number, status: string, snapshot: { steps: { id: string, times?: number, sets?: number, target?: { kg?: number } }[], block: { week: number, weeks: number, kind: string, changes: string[], name: string } } }

async function blockSessions(blockId: number, athleteId?: number): Promise<SnapshotRow[]> {
  const result = await running.db.execute({
    sql: `select id, athlete_id, date, block_week, routine_id, status, snapshot from assignments where block_id = ? ${athleteId ? 'and athlete_id = ?' : ''} order by date, id`,
    args: athleteId ? [blockId, athleteId] : [blockId],
  })
  return result.rows.map(row => ({ id: Number(row.id), athleteId: Number(row.athlete_id), date: String(row.date), week: Number(row.block_week), routineId: Number(row.routine_id), status: String(row.status), snapshot: JSON.parse(String(row.snapshot)) }))
}

const roundsOf = (row: SnapshotRow) => row.snapshot.steps.find(step => step.id === 'reps')!.times
const setsOf = (row: SnapshotRow) => row.snapshot.steps.find(step => step.id === 'squat')!.sets
const kgOf = (row: SnapshotRow) => row.snapshot.steps.find(step => step.id === 'squat')!.target!.kg

describe('planning a block', () => {
  it('writes every week with its own snapshot and sends one notice per athlete', async () => {
    const team = await blockTeam(2)
    const preview = await team.coach.post<{ weeks: { week: number, kind: string, cells: { numbers: { rounds: number, loadKg: number | null } }[] }[] }>('/api/blocks/preview', hillBlock(team))
    expect(preview.status).toBe(200)
    expect(preview.data.weeks.map(week => week.cells[0]!.numbers.rounds)).toEqual([6, 7, 8, 5, 10, 10, 10, 6])

    const created = await team.coach.post<{ id: number }>('/api/blocks', hillBlock(team))
    expect(created.status).toBe(201)
    expect(await countRows(running.db, 'assignments', team.teamId)).toBe(0)
    const planned = await team.coach.post<{ created: number, fromWeek: number, replanned: boolean }>(`/api/blocks/${created.data.id}/plan`)
    expect(planned.status).toBe(200)
    // 2 athletes × 8 weeks × 2 routines.
    expect(planned.data).toMatchObject({ created: 32, fromWeek: 1, replanned: false })

    const rows = await blockSessions(created.data.id, team.athletes[0]!.userId)
    const hills = rows.filter(row => row.routineId === team.hills)
    const gym = rows.filter(row => row.routineId === team.gym)
    // Tuesdays from Mon 1 Mar 2027, Thursdays likewise.
    expect(hills.map(row => row.date)).toEqual(['2027-03-02', '2027-03-09', '2027-03-16', '2027-03-23', '2027-03-30', '2027-04-06', '2027-04-13', '2027-04-20'])
    expect(gym[0]!.date).toBe('2027-03-04')
    // 6 + (week − 1), capped at 10; week 4 lighter: 9 × 0.6 = 5.4 → 5; week 8 taper (the race week): 10 × 0.6 = 6.
    expect(hills.map(roundsOf)).toEqual([6, 7, 8, 5, 10, 10, 10, 6])
    expect(hills.map(row => row.snapshot.block.kind)).toEqual(['regular', 'regular', 'regular', 'lighter', 'regular', 'regular', 'regular', 'taper'])
    expect(hills.map(row => row.week)).toEqual([1, 2, 3, 4, 5, 6, 7, 8])
    expect(hills[1]!.snapshot.block).toMatchObject({ week: 2, weeks: 8, name: 'Spring hills', changes: ['+1 round'] })
    expect(hills[3]!.snapshot.block.changes).toEqual(['−3 rounds'])
    // 40 kg + 2 kg a week (raw 38 + 2n) to the nearest 2.5 kg: 40; 42 → 42.5; 44 → 45; 46 → 45 (18.4 steps);
    // 48 → 47.5; 50; 52 → 52.5 (20.8); 54 → 55 (21.6). Lighter and taper weeks keep the load and cut the sets:
    // 3 × 0.6 = 1.8 → 2.
    expect(gym.map(kgOf)).toEqual([40, 42.5, 45, 45, 47.5, 50, 52.5, 55])
    expect(gym.map(setsOf)).toEqual([3, 3, 3, 2, 3, 3, 3, 2])

    await outboxSettled(running.db)
    for (const athlete of team.athletes) {
      const notices = running.stack.mail.to(athlete.email).filter(mail => /training block/i.test(mail.subject ?? ''))
      expect(notices).toHaveLength(1)
      expect(notices[0]!.text).toContain('16 sessions')
      expect(notices[0]!.text).toContain('Spring hills')
    }

    const mine = await team.athletes[0]!.athlete.get<{ assignments: { block: { week: number, weeks: number } | null }[] }>('/api/me/assignments?from=2027-03-08&to=2027-03-14')
    expect(mine.data.assignments.map(item => item.block?.week)).toEqual([2, 2])
    const view = await team.athletes[0]!.athlete.get<{ weeks: { week: number, kind: string, sessions: { numbers: { rounds: number } }[] }[] }>(`/api/me/blocks/${created.data.id}`)
    expect(view.status).toBe(200)
    expect(view.data.weeks[3]).toMatchObject({ week: 4, kind: 'lighter' })
    expect(view.data.weeks[1]!.sessions[0]!.numbers.rounds).toBe(7)

    // "Update to the latest version" in the planner leaves block sessions and their week's numbers alone.
    const refreshed = await team.coach.post<{ updated: number }>('/api/assignments/refresh-routine', { routineId: team.hills })
    expect(refreshed.data.updated).toBe(0)
    expect((await blockSessions(created.data.id, team.athletes[0]!.userId)).filter(row => row.routineId === team.hills).map(roundsOf)).toEqual([6, 7, 8, 5, 10, 10, 10, 6])

    // The calendar feed says the week too.
    const feed = await team.athletes[0]!.athlete.post<{ url: string }>('/api/me/calendar-feed')
    const calendar = new ICAL.Component(ICAL.parse(await (await fetch(feed.data.url)).text()) as unknown[])
    const events = calendar.getAllSubcomponents('vevent').map(component => new ICAL.Event(component))
    const fourth = events.find(event => event.startDate.toString() === '2027-03-23')!
    expect(fourth.description).toContain('Spring hills: week 4 of 8, lighter week. −3 rounds from last week.')
  })

  it('re-plans only the weeks ahead and keeps logged sessions', async () => {
    const team = await blockTeam(1)
    const athleteId = team.athletes[0]!.userId
    const start = addDays(utcToday(), -14)
    const body = hillBlock(team, { startDate: start, goalRace: null, routines: [{ routineId: team.hills, weekday: 1, rules: [{ stepId: 'reps', field: 'rounds', by: 1, cap: 10 }] }] })
    const { data: { id } } = await team.coach.post<{ id: number }>('/api/blocks', body)
    expect((await team.coach.post(`/api/blocks/${id}/plan`)).status).toBe(200)
    const before = await blockSessions(id, athleteId)
    // Log the first week's session as done.
    const first = before[0]!
    await running.db.execute({ sql: 'insert into session_logs (team_id, assignment_id, athlete_id, client_id, started_at, finished_at, day, duration_s) values (?, ?, ?, ?, ?, ?, ?, ?)', args: [team.teamId, first.id, athleteId, 'test-client-1', Date.now(), Date.now(), first.date, 1800] })
    await running.db.execute({ sql: 'update assignments set status = \'done\' where id = ?', args: [first.id] })

    // Now two rounds a week, capped at 12, on the same routine slot.
    const current = await team.coach.get<{ block: { routines: { id: number }[] } }>(`/api/blocks/${id}`)
    const slotId = current.data.block.routines[0]!.id
    const changed = await team.coach.put<{ planning: { upToDate: boolean, nextWeek: number } }>(`/api/blocks/${id}`, { ...body, routines: [{ ...body.routines[0], id: slotId, rules: [{ stepId: 'reps', field: 'rounds', by: 2, cap: 12 }] }] })
    expect(changed.status).toBe(200)
    // Weeks 1–3 have started (week 3 starts today); week 4 is the first ahead.
    expect(changed.data.planning).toMatchObject({ upToDate: false, nextWeek: 4 })
    // The slot kept its id, so the planned sessions stay linked to it.
    const replanned = await team.coach.post<{ created: number, removed: number, fromWeek: number, replanned: boolean }>(`/api/blocks/${id}/plan`)
    expect(replanned.data).toMatchObject({ fromWeek: 4, created: 5, removed: 5, replanned: true })

    const after = await blockSessions(id, athleteId)
    expect(new Set(after.map(row => row.snapshot.block.name))).toEqual(new Set(['Spring hills']))
    expect(after.slice(0, 3).map(row => row.id)).toEqual(before.slice(0, 3).map(row => row.id))
    // Week 4 says what changed from week 3 as the athlete had it (8 rounds), not as the new rules would have it.
    expect(after[3]!.snapshot.block.changes).toEqual(['−1 round'])
    // Weeks 1–3 as first planned: 6, 7, 8 rounds. Ahead: 6 + 2(n − 1) capped at 12 → week 4 lighter 12 × 0.6 = 7.2 → 7, then 12, 12, 12, taper 12 × 0.6 = 7.2 → 7.
    expect(after.map(roundsOf)).toEqual([6, 7, 8, 7, 12, 12, 12, 7])
    expect(after[0]!.status).toBe('done')
    const logs = await running.db.execute({ sql: 'select count(*) as n from session_logs where assignment_id = ?', args: [first.id] })
    expect(Number(logs.rows[0]!.n)).toBe(1)
    await outboxSettled(running.db)
    expect(running.stack.mail.to(team.athletes[0]!.email).filter(mail => /Updated block/.test(mail.subject ?? ''))).toHaveLength(1)

    // Planned against done: week 1 planned 10 + 6 × 1 + 5 × 1.5 + 10 = 33.5 min, done 30 min.
    const progress = await team.coach.get<{ series: { key: string, weeks: { week: number, plannedMin: number, doneMin: number, doneSessions: number }[] }[] }>(`/api/blocks/${id}/progress`)
    expect(progress.status).toBe(200)
    const mine = progress.data.series.find(series => series.key === `athlete-${athleteId}`)!
    expect(mine.weeks[0]).toMatchObject({ week: 1, plannedMin: 33.5, doneMin: 30, doneSessions: 1 })
    expect(progress.data.series.find(series => series.key === `squad-${team.squadId}`)!.weeks[0]!.doneMin).toBe(30)
  })

  it('sets one week by hand and rewrites its planned sessions', async () => {
    const team = await blockTeam(1)
    const { data: { id } } = await team.coach.post<{ id: number }>('/api/blocks', hillBlock(team))
    await team.coach.post(`/api/blocks/${id}/plan`)
    const view = await team.coach.get<{ block: { routines: { id: number, routineId: number }[] } }>(`/api/blocks/${id}`)
    const slot = view.data.block.routines.find(item => item.routineId === team.hills)!
    const set = await team.coach.put<{ updated: number }>(`/api/blocks/${id}/weeks/5`, { blockRoutineId: slot.id, values: [{ stepId: 'reps', field: 'rounds', value: 7 }] })
    expect(set.status).toBe(200)
    // Week 5 and week 6 (whose "what changed" depends on week 5).
    expect(set.data.updated).toBe(2)
    const hills = (await blockSessions(id)).filter(row => row.routineId === team.hills)
    expect(hills.map(roundsOf)).toEqual([6, 7, 8, 5, 7, 10, 10, 6])
    expect(hills[5]!.snapshot.block.changes).toEqual(['+3 rounds'])

    const bad = await team.coach.put<FieldError>(`/api/blocks/${id}/weeks/5`, { blockRoutineId: slot.id, values: [{ stepId: 'reps', field: 'rounds', value: 150 }] })
    expect(bad.status).toBe(400)
    expect(bad.data.data?.fields).toHaveProperty(['values.0.value'])
  })
})

describe('planning is all or nothing', () => {
  it('leaves nothing behind when one session cannot be written', async () => {
    const team = await blockTeam(2)
    const { data: { id } } = await team.coach.post<{ id: number }>('/api/blocks', hillBlock(team))
    const before = await Promise.all([countRows(running.db, 'assignments', team.teamId), countRows(running.db, 'email_outbox', team.teamId)])
    // A storage failure on the second athlete's last week, after every other row was written.
    await running.db.execute(`create trigger fail_block_week before insert on assignments when new.block_week = 8 and new.athlete_id = ${team.athletes[1]!.userId} begin select raise(abort, 'disk trouble'); end`)
    try {
      const response = await team.coach.post(`/api/blocks/${id}/plan`)
      expect(response.status).toBeGreaterThanOrEqual(500)
      expect(response.text).not.toMatch(/at .*\.mjs:\d+/)
    }
    finally {
      await running.db.execute('drop trigger fail_block_week')
    }
    expect(await Promise.all([countRows(running.db, 'assignments', team.teamId), countRows(running.db, 'email_outbox', team.teamId)])).toEqual(before)
    const view = await team.coach.get<{ planning: { plannedAt: string | null } }>(`/api/blocks/${id}`)
    expect(view.data.planning.plannedAt).toBeNull()
    const retry = await team.coach.post<{ created: number }>(`/api/blocks/${id}/plan`)
    expect(retry.data.created).toBe(32)
  })
})

describe('block validation', () => {
  it('answers 400 naming the field', async () => {
    const team = await blockTeam(1)
    const cases: [Record<string, unknown>, string][] = [
      [{ weeks: 27 }, 'weeks'],
      [{ weeks: 0 }, 'weeks'],
      [{ weeks: 3, taper: { weeks: 3, factor: 0.6 } }, 'taper.weeks'],
      [{ taper: { weeks: 4, factor: 0.6 } }, 'taper.weeks'],
      [{ goalRace: { name: 'Larchford Ridge 10', date: '2027-02-20', distanceM: 10_000 } }, 'goalRace.date'],
      [{ routines: [{ routineId: team.hills, weekday: 2, rules: [{ stepId: 'reps', field: 'rounds', by: 1, cap: 150 }] }] }, 'routines.0.rules.0.cap'],
      [{ weeks: 26, routines: [{ routineId: team.hills, weekday: 2, rules: [{ stepId: 'reps', field: 'rounds', by: 5 }] }] }, 'routines.0.rules.0.by'],
      [{ weeks: 26, routines: [{ routineId: team.gym, weekday: 2, rules: [{ stepId: 'squat', field: 'loadKg', by: 20 }] }] }, 'routines.0.rules.0.by'],
      [{ routines: [{ routineId: team.gym, weekday: 2, rules: [{ stepId: 'squat', field: 'percent1rm', by: 1, cap: 105 }] }] }, 'routines.0.rules.0.cap'],
      [{ routines: [{ routineId: team.gym, weekday: 2, rules: [{ stepId: 'nowhere', field: 'sets', by: 1 }] }] }, 'routines.0.rules.0.stepId'],
      [{ routines: [{ routineId: team.hills, weekday: 8 }] }, 'routines.0.weekday'],
      [{ routines: [] }, 'routines'],
      [{ squadIds: [], athleteIds: [] }, 'athleteIds'],
    ]
    for (const [change, field] of cases) {
      const response = await team.coach.post<FieldError>('/api/blocks', hillBlock(team, change))
      expect(response.status, JSON.stringify(change)).toBe(400)
      expect(response.data.data?.fields, JSON.stringify(change)).toHaveProperty([field])
    }
    expect(await running.db.execute({ sql: 'select count(*) as n from blocks where team_id = ?', args: [team.teamId] }).then(result => Number(result.rows[0]!.n))).toBe(0)
    const nonsense = await team.coach.request('POST', '/api/blocks', undefined, { raw: '{not json' })
    expect(nonsense.status).toBe(400)
  })
})

describe('block scoping', () => {
  it('keeps blocks inside their team', async () => {
    const team = await blockTeam(1)
    const other = await blockTeam(1)
    const { data: { id } } = await team.coach.post<{ id: number }>('/api/blocks', hillBlock(team))
    for (const [method, path, body] of [
      ['GET', `/api/blocks/${id}`, undefined],
      ['PUT', `/api/blocks/${id}`, hillBlock(other)],
      ['POST', `/api/blocks/${id}/plan`, {}],
      ['GET', `/api/blocks/${id}/progress`, undefined],
      ['PUT', `/api/blocks/${id}/weeks/2`, { blockRoutineId: 1, values: [] }],
    ] as const) {
      const response = await other.coach.request(method, path, body)
      expect(response.status, `${method} ${path}`).toBe(404)
    }
    // Another team's routine or squad in a block: 404, as everywhere else.
    expect((await other.coach.post('/api/blocks', hillBlock(other, { routines: [{ routineId: team.hills, weekday: 2 }] }))).status).toBe(404)
    expect((await other.coach.post('/api/blocks', hillBlock(other, { squadIds: [team.squadId] }))).status).toBe(404)
    expect((await other.coach.get<unknown[]>('/api/blocks')).data).toEqual([])
    // Athletes cannot use the coach's routes, nor see a block they have no sessions in.
    expect((await team.athletes[0]!.athlete.get(`/api/blocks/${id}`)).status).toBe(403)
    expect((await team.athletes[0]!.athlete.get(`/api/me/blocks/${id}`)).status).toBe(404)
    await team.coach.post(`/api/blocks/${id}/plan`)
    expect((await team.athletes[0]!.athlete.get(`/api/me/blocks/${id}`)).status).toBe(200)
    expect((await other.athletes[0]!.athlete.get(`/api/me/blocks/${id}`)).status).toBe(404)
    expect((await new ApiClient(running.stack.url).get(`/api/blocks/${id}`)).status).toBe(401)
  })
})
