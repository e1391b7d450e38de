import { describe, expect, it } from 'vitest'
import { ApiClient, type FieldError } from '../support/client'
import { addAthlete, registerCoach } from '../support/team'
import type { RoutinePreview } from '../../shared/types/routine'
import type { RoutineStep } from '../../shared/schemas/routine-steps'
import { useStack } from '../support/hooks'
import type { RoutineDetail, RoutineList } from '../../types/api'

const running = useStack()

interface Conflict extends FieldError { data?: { fields?: Record<string, string>, currentVersion?: number } }

async function insertExercise(teamId: number, name: string, options: { category?: string, cautions?: { text: string, bodyAreas: string[] }[], archived?: boolean } = {}) {
  const result = await running.db.execute({
    sql: 'insert into exercises (team_id, name, category, cautions, archived_at) values (?, ?, ?, ?, ?) returning id',
    args: [teamId, name, options.category ?? 'strength', JSON.stringify(options.cautions ?? []), options.archived ? Date.now() : null],
  })
  return Number(result.rows[0]!.id)
}

async function usedExercises(routineId: number) {
  const result = await running.db.execute({ sql: 'select exercise_id from routine_exercises where routine_id = ? order by exercise_id', args: [routineId] })
  return result.rows.map(row => Number(row.exercise_id))
}

async function routineCount(teamId: number) {
  const result = await running.db.execute({ sql: 'select count(*) as n from routines where team_id = ?', args: [teamId] })
  return Number(result.rows[0]!.n)
}

const hillSteps = (): RoutineStep[] => [
  { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 600 }, target: { type: 'pace', zone: 'easy' } },
  {
    id: 'hills',
    type: 'repeat',
    times: 8,
    steps: [
      { id: 'up', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 }, target: { type: 'pace', zone: 'fiveK' }, grade: 0.06 },
      { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 } },
    ],
  },
  { id: 'cool', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 600 } },
]

describe('routines: create, read, list, save', () => {
  it('creates, reads back, lists with totals and saves new versions', async () => {
    const { coach, teamId } = await registerCoach(running.stack)
    const calf = await insertExercise(teamId, 'Single-leg calf raise', { cautions: [{ text: 'Slow on the way down', bodyAreas: ['achilles', 'calf'] }] })
    const steps: RoutineStep[] = [...hillSteps(), { id: 'calf', type: 'sets', exerciseId: calf, sets: 3, perSet: { by: 'reps', reps: 12 }, restSeconds: 60 }]
    const created = await coach.post<{ id: number, version: number }>('/api/routines', { title: 'Ridge Lane short hills', category: 'hills', description: 'Eight climbs', steps })
    expect(created.status).toBe(201)
    expect(created.data.version).toBe(1)

    const read = await coach.get<RoutineDetail>(`/api/routines/${created.data.id}`)
    expect(read.status).toBe(200)
    expect(read.data.steps).toEqual(steps)
    expect(read.data.exercises).toEqual([expect.objectContaining({ id: calf, name: 'Single-leg calf raise' })])
    expect(await usedExercises(created.data.id)).toEqual([calf])

    const list = await coach.get<RoutineList>('/api/routines')
    expect(list.data.items.map(item => item.id)).toContain(created.data.id)
    const item = list.data.items.find(entry => entry.id === created.data.id)!
    // 600 + 8 × 150 + 600, then 3 × 12 reps at 3 s a rep and 2 rests of 60 s
    expect(item.totals.durationS).toBe(2400 + 108 + 120)
    expect(item.totals.workS).toBe(480 + 108)

    expect((await coach.get<RoutineList>('/api/routines?q=RIDGE lane')).data.items.map(entry => entry.id)).toEqual([created.data.id])
    expect((await coach.get<RoutineList>('/api/routines?q=nothing-like-this')).data.items).toEqual([])
    expect((await coach.get<RoutineList>('/api/routines?category=strength')).data.items).toEqual([])
    expect((await coach.get<RoutineList>('/api/routines?category=hills')).data.total).toBe(1)
    expect((await coach.get<FieldError>('/api/routines?category=swimming')).status).toBe(400)

    const saved = await coach.put<{ version: number }>(`/api/routines/${created.data.id}`, { title: 'Ridge Lane hills', category: 'hills', description: '', steps: hillSteps(), version: 1 })
    expect(saved.status).toBe(200)
    expect(saved.data.version).toBe(2)
    expect(await usedExercises(created.data.id)).toEqual([])
    const again = await coach.put<{ version: number }>(`/api/routines/${created.data.id}`, { title: 'Ridge Lane hills', category: 'mixed', description: '', steps: hillSteps(), version: 2 })
    expect(again.data.version).toBe(3)
    expect((await coach.get<RoutineDetail>(`/api/routines/${created.data.id}`)).data).toMatchObject({ category: 'mixed', version: 3 })
  })

  it('refuses a stale save with 409 and keeps the newer version', async () => {
    const { coach } = await registerCoach(running.stack)
    const { data: { id } } = await coach.post<{ id: number }>('/api/routines', { title: 'Strides', category: 'drills', steps: hillSteps() })
    const body = { title: 'Edited in tab one', category: 'drills', description: '', steps: hillSteps(), version: 1 }
    expect((await coach.put(`/api/routines/${id}`, body)).status).toBe(200)
    const stale = await coach.put<Conflict>(`/api/routines/${id}`, { ...body, title: 'Edited in tab two' })
    expect(stale.status).toBe(409)
    expect(stale.data.data?.currentVersion).toBe(2)
    expect(stale.data.message).toMatch(/saved this routine after you opened it/)
    const current = await coach.get<RoutineDetail>(`/api/routines/${id}`)
    expect(current.data).toMatchObject({ title: 'Edited in tab one', version: 2 })
    const missing = await coach.put<FieldError>(`/api/routines/${id}`, { ...body, version: undefined })
    expect(missing.status).toBe(400)
    expect(missing.data.data?.fields?.version).toBeTruthy()
  })

  it('duplicates with a fresh version and its own exercise index, and archives', async () => {
    const { coach, teamId } = await registerCoach(running.stack)
    const squat = await insertExercise(teamId, 'Goblet squat')
    const steps: RoutineStep[] = [{ id: 'sq', type: 'sets', exerciseId: squat, sets: 3, perSet: { by: 'reps', reps: 10 }, restSeconds: 90, target: { type: 'load', kg: 16 } }]
    const { data: original } = await coach.post<{ id: number }>('/api/routines', { title: 'Gym circuit', category: 'strength', steps })
    await coach.put(`/api/routines/${original.id}`, { title: 'Gym circuit', category: 'strength', description: '', steps, version: 1 })
    const copy = await coach.post<{ id: number, version: number, title: string }>(`/api/routines/${original.id}/duplicate`)
    expect(copy.status).toBe(201)
    expect(copy.data).toMatchObject({ version: 1, title: 'Gym circuit (copy)' })
    expect(copy.data.id).not.toBe(original.id)
    expect((await coach.get<RoutineDetail>(`/api/routines/${copy.data.id}`)).data.steps).toEqual(steps)
    expect(await usedExercises(copy.data.id)).toEqual([squat])
    const named = await coach.post<{ title: string }>(`/api/routines/${original.id}/duplicate`, { title: 'Gym circuit, week 2' })
    expect(named.data.title).toBe('Gym circuit, week 2')

    const archived = await coach.post<{ archivedAt: string | null }>(`/api/routines/${original.id}/archive`)
    expect(archived.status).toBe(200)
    expect(archived.data.archivedAt).toBeTruthy()
    expect((await coach.get<RoutineList>('/api/routines')).data.items.map(item => item.id)).not.toContain(original.id)
    expect((await coach.get<RoutineList>('/api/routines?archived=true')).data.items.map(item => item.id)).toEqual([original.id])
    expect((await coach.get<RoutineDetail>(`/api/routines/${original.id}`)).status).toBe(200)
    await coach.post(`/api/routines/${original.id}/archive`, { archived: false })
    expect((await coach.get<RoutineList>('/api/routines')).data.items.map(item => item.id)).toContain(original.id)
  })
})

describe('routines: bad input', () => {
  it('names the step and field of an invalid tree and saves nothing', async () => {
    const { coach, teamId } = await registerCoach(running.stack)
    const before = await routineCount(teamId)
    const bad = hillSteps()
    ;(bad[1] as Extract<RoutineStep, { type: 'repeat' }>).steps[1] = { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 0 } }
    const response = await coach.post<FieldError>('/api/routines', { title: 'Broken', category: 'hills', steps: bad })
    expect(response.status).toBe(400)
    expect(response.data.data?.fields?.['steps.1.steps.1.measure.seconds']).toMatch(/more than 0/)
    expect(response.data.message).toMatch(/steps\.1\.steps\.1\.measure\.seconds/)

    const tooMany = await coach.post<FieldError>('/api/routines', { title: 'Too many', category: 'hills', steps: [{ ...hillSteps()[1], times: 101 }] })
    expect(tooMany.status).toBe(400)
    expect(tooMany.data.data?.fields?.['steps.0.times']).toMatch(/at most 100/)

    const leaf: RoutineStep = { id: 'x', type: 'block', kind: 'work', measure: { by: 'time', seconds: 10 } }
    const nest = (depth: number, id = 'r'): RoutineStep => ({ id: `${id}${depth}`, type: 'repeat', times: 2, steps: [depth > 1 ? nest(depth - 1, id) : leaf] })
    expect((await coach.post('/api/routines', { title: 'Three deep', category: 'hills', steps: [nest(3)] })).status).toBe(201)
    const fourDeep = await coach.post<FieldError>('/api/routines', { title: 'Four deep', category: 'hills', steps: [nest(4)] })
    expect(fourDeep.status).toBe(400)
    expect(Object.values(fourDeep.data.data?.fields ?? {}).join(' ')).toMatch(/nested at most 3/)

    const long = await coach.post<FieldError>('/api/routines', { title: 'Too long', category: 'mixed', steps: [{ id: 'l', type: 'repeat', times: 3, steps: [{ id: 'l1', type: 'block', kind: 'work', measure: { by: 'time', seconds: 5 * 3600 } }] }] })
    expect(long.status).toBe(400)
    expect(Object.values(long.data.data?.fields ?? {}).join(' ')).toMatch(/at most 12 hours/)

    const noTitle = await coach.post<FieldError>('/api/routines', { title: '  ', category: 'gym', steps: [] })
    expect(noTitle.status).toBe(400)
    expect(Object.keys(noTitle.data.data?.fields ?? {})).toEqual(expect.arrayContaining(['title', 'category']))
    const malformed = await coach.request<FieldError>('POST', '/api/routines', undefined, { raw: '{"title": ' })
    expect(malformed.status).toBe(400)
    expect(malformed.text).not.toMatch(/\.mjs:\d+/)
    expect(await routineCount(teamId)).toBe(before + 1)
  })

  it('rejects exercises from another team, and newly added archived ones', async () => {
    const mine = await registerCoach(running.stack)
    const theirs = await registerCoach(running.stack, 'Brackenmoor Road Runners')
    const foreign = await insertExercise(theirs.teamId, 'Their hill sprint', { category: 'hill' })
    const old = await insertExercise(mine.teamId, 'Old lunge', { archived: true })
    const own = await insertExercise(mine.teamId, 'Step-up')
    const before = await routineCount(mine.teamId)
    const step = (id: string, exerciseId: number): RoutineStep => ({ id, type: 'sets', exerciseId, sets: 2, perSet: { by: 'reps', reps: 8 }, restSeconds: 60 })

    const crossTeam = await mine.coach.post<FieldError>('/api/routines', { title: 'Borrowed', category: 'strength', steps: [step('a', own), { id: 'r', type: 'repeat', times: 2, steps: [step('b', foreign)] }] })
    expect(crossTeam.status).toBe(400)
    expect(crossTeam.data.data?.fields).toEqual({ 'steps.1.steps.0.exerciseId': 'This exercise is not in your library' })
    const unknown = await mine.coach.post<FieldError>('/api/routines', { title: 'Ghost', category: 'strength', steps: [step('a', 999_999)] })
    expect(unknown.data.data?.fields?.['steps.0.exerciseId']).toBeTruthy()
    const archived = await mine.coach.post<FieldError>('/api/routines', { title: 'Old', category: 'strength', steps: [step('a', old)] })
    expect(archived.status).toBe(400)
    expect(archived.data.data?.fields?.['steps.0.exerciseId']).toMatch(/archived/)
    expect(await routineCount(mine.teamId)).toBe(before)

    // An exercise archived after it went into a routine may stay there.
    const kept = await insertExercise(mine.teamId, 'Soon archived')
    const { data: routine } = await mine.coach.post<{ id: number }>('/api/routines', { title: 'Keeps it', category: 'strength', steps: [step('a', kept)] })
    await running.db.execute({ sql: 'update exercises set archived_at = ? where id = ?', args: [Date.now(), kept] })
    const resaved = await mine.coach.put(`/api/routines/${routine.id}`, { title: 'Keeps it', category: 'strength', description: '', steps: [step('a', kept), step('b', own)], version: 1 })
    expect(resaved.status).toBe(200)
    expect(await usedExercises(routine.id)).toEqual([own, kept].sort((x, y) => x - y))
    const failed = await mine.coach.put<FieldError>(`/api/routines/${routine.id}`, { title: 'Keeps it', category: 'strength', description: '', steps: [step('a', foreign)], version: 2 })
    expect(failed.status).toBe(400)
    expect(await usedExercises(routine.id)).toEqual([own, kept].sort((x, y) => x - y))
    expect((await mine.coach.get<RoutineDetail>(`/api/routines/${routine.id}`)).data.version).toBe(2)
  })
})

describe('routines: who may do what', () => {
  it('hides other teams\' routines behind 404, keeps athletes out with 403 and strangers with 401', async () => {
    const owner = await registerCoach(running.stack)
    const other = await registerCoach(running.stack, 'Quenmere Striders')
    const { athlete } = await addAthlete(running.stack, owner.coach)
    const { data: { id } } = await owner.coach.post<{ id: number }>('/api/routines', { title: 'Private hills', category: 'hills', steps: hillSteps() })
    const body = { title: 'Taken over', category: 'hills', description: '', steps: hillSteps(), version: 1 }

    expect((await other.coach.get(`/api/routines/${id}`)).status).toBe(404)
    expect((await other.coach.put(`/api/routines/${id}`, body)).status).toBe(404)
    expect((await other.coach.post(`/api/routines/${id}/duplicate`)).status).toBe(404)
    expect((await other.coach.post(`/api/routines/${id}/archive`)).status).toBe(404)
    expect((await other.coach.get(`/api/routines/${id}/preview?athleteId=1`)).status).toBe(404)
    expect((await other.coach.get<RoutineList>('/api/routines')).data.items).toEqual([])
    expect((await other.coach.get(`/api/routines/${id + 100_000}`)).status).toBe(404)

    expect((await athlete.get('/api/routines')).status).toBe(403)
    expect((await athlete.get(`/api/routines/${id}`)).status).toBe(403)
    expect((await athlete.put(`/api/routines/${id}`, body)).status).toBe(403)
    expect((await athlete.post('/api/routines', { title: 'Mine', category: 'hills', steps: [] })).status).toBe(403)

    const stranger = new ApiClient(running.stack.url)
    expect((await stranger.get('/api/routines')).status).toBe(401)
    expect((await stranger.post('/api/routines', { title: 'x', category: 'hills', steps: [] })).status).toBe(401)
    expect((await owner.coach.get<RoutineDetail>(`/api/routines/${id}`)).data.title).toBe('Private hills')
  })
})

describe('routines: preview for an athlete', () => {
  it('fills in the athlete\'s paces, grade-adjusted hill paces, %1RM loads and matching cautions', async () => {
    const { coach, teamId } = await registerCoach(running.stack)
    const { userId: athleteId } = await addAthlete(running.stack, coach, { name: 'Tamsin Rook' })
    await running.db.execute({ sql: 'update athlete_profiles set benchmark_distance_m = 10000, benchmark_time_s = 2400, benchmark_date = ? where user_id = ?', args: ['2026-09-20', athleteId] })
    await running.db.execute({ sql: 'insert into injury_notes (team_id, athlete_id, body_area, status, note) values (?, ?, ?, ?, ?), (?, ?, ?, ?, ?)', args: [teamId, athleteId, 'achilles', 'active', 'Stiff in the mornings', teamId, athleteId, 'knee', 'resolved', 'Old niggle'] })
    const calf = await insertExercise(teamId, 'Single-leg calf raise', { cautions: [{ text: 'Lower slowly', bodyAreas: ['achilles', 'calf'] }, { text: 'Hold a rail for balance', bodyAreas: [] }] })
    const hill = await insertExercise(teamId, 'Hill sprint', { category: 'hill', cautions: [{ text: 'Walk down to protect the knees', bodyAreas: ['knee'] }] })
    const deadlift = await insertExercise(teamId, 'Romanian deadlift')

    const steps: RoutineStep[] = [
      ...hillSteps(),
      { id: 'sprint', type: 'block', kind: 'work', exerciseId: hill, measure: { by: 'time', seconds: 10 } },
      { id: 'calf', type: 'sets', exerciseId: calf, sets: 3, perSet: { by: 'reps', reps: 12 }, restSeconds: 60 },
      { id: 'rdl', type: 'sets', exerciseId: deadlift, sets: 3, perSet: { by: 'reps', reps: 6 }, restSeconds: 120, target: { type: 'percent1rm', percent: 80 } },
      { id: 'run', type: 'block', kind: 'work', measure: { by: 'distance', meters: 1000 }, target: { type: 'pace', zone: 'tenK' } },
    ]
    const { data: { id } } = await coach.post<{ id: number }>('/api/routines', { title: 'Everything', category: 'mixed', steps })

    // A logged set of 80 kg × 5: Epley (1985) estimates 80 × (1 + 5/30) ≈ 93.3 kg.
    const assignment = await running.db.execute({ sql: 'insert into assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date) values (?, ?, ?, 1, ?, ?) returning id', args: [teamId, athleteId, id, JSON.stringify({ title: 'x', category: 'mixed', description: '', steps: [], exercises: [] }), '2026-11-02'] })
    const session = await running.db.execute({ sql: 'insert into session_logs (team_id, assignment_id, athlete_id, client_id, started_at, day) values (?, ?, ?, ?, ?, ?) returning id', args: [teamId, Number(assignment.rows[0]!.id), athleteId, 'c1', Date.now(), '2026-11-02'] })
    await running.db.execute({ sql: 'insert into entry_logs (team_id, session_id, athlete_id, idempotency_key, step_id, exercise_id, reps, kg) values (?, ?, ?, ?, ?, ?, ?, ?)', args: [teamId, Number(session.rows[0]!.id), athleteId, 'k1', 'rdl', deadlift, 5, 80] })

    const response = await coach.get<RoutinePreview>(`/api/routines/${id}/preview?athleteId=${athleteId}`)
    expect(response.status).toBe(200)
    const preview = response.data
    expect(preview.athlete).toMatchObject({ id: athleteId, name: 'Tamsin Rook', benchmark: { distanceM: 10_000, timeS: 2400 } })
    // A 10K in 40:00 predicts itself: 240 s/km (Daniels & Gilbert 1979 equivalence).
    expect(preview.paces?.tenK).toBeCloseTo(240, 6)
    expect(preview.targets.run!.pace).toEqual({ fast: preview.paces!.tenK, slow: preview.paces!.tenK })
    // Uphill at 6 % costs more energy per metre (Minetti et al. 2002), so the same effort is slower.
    const up = preview.targets.up!
    expect(up.pace!.fast).toBeCloseTo(preview.paces!.fiveK, 6)
    expect(up.grade).toBe(0.06)
    expect(up.hillPace!.fast).toBeGreaterThan(up.pace!.fast * 1.2)
    expect(preview.targets.warm!.pace!.slow).toBeGreaterThan(preview.targets.warm!.pace!.fast)
    // 80 % of 93.3 kg is 74.7 kg, rounded to the nearest 2.5 kg plate step.
    expect(preview.targets.rdl).toMatchObject({ loadKg: 75 })
    expect(preview.targets.rdl!.estimatedMaxKg).toBeCloseTo(93.33, 1)
    // The distance step is timed from the athlete's 10K pace, so it is not an estimate.
    const runSegment = preview.timeline.segments.find(segment => segment.stepId === 'run')!
    expect(runSegment.durationS).toBeCloseTo(240, 6)
    expect(runSegment.estimated).toBe(false)

    const matched = preview.cautions.filter(caution => caution.matchedAreas.length > 0)
    // The hill steps carry their own uphill caution (Achilles, calf), which the Achilles note matches too.
    expect(matched).toEqual([
      expect.objectContaining({ exerciseId: calf, text: 'Lower slowly', matchedAreas: ['achilles'] }),
      expect.objectContaining({ source: 'step', exerciseId: null, exerciseName: 'Uphill efforts', matchedAreas: ['achilles'] }),
    ])
    expect(preview.cautions[0]!.text).toBe('Lower slowly')
    // The knee note is resolved, so the knee caution is listed but not highlighted.
    expect(preview.cautions.find(caution => caution.exerciseId === hill)!.matchedAreas).toEqual([])
    expect(preview.injuryNotes).toEqual([expect.objectContaining({ bodyArea: 'achilles' })])
    expect(preview.generalCautions.join(' ')).toMatch(/downhill/)
  })

  it('says what is missing without a benchmark, and refuses athletes outside the team', async () => {
    const { coach } = await registerCoach(running.stack)
    const { userId } = await addAthlete(running.stack, coach)
    const other = await registerCoach(running.stack, 'Varrow Edge Harriers')
    const { userId: outsider } = await addAthlete(running.stack, other.coach)
    const { data: { id } } = await coach.post<{ id: number }>('/api/routines', { title: 'Hills', category: 'hills', steps: hillSteps() })
    const preview = await coach.get<RoutinePreview>(`/api/routines/${id}/preview?athleteId=${userId}`)
    expect(preview.status).toBe(200)
    expect(preview.data.paces).toBeNull()
    expect(preview.data.targets.up!.missing).toMatch(/benchmark/)
    expect((await coach.get(`/api/routines/${id}/preview?athleteId=${outsider}`)).status).toBe(404)
    expect((await coach.get(`/api/routines/${id}/preview?athleteId=${other.userId}`)).status).toBe(404)
    const noAthlete = await coach.get<FieldError>(`/api/routines/${id}/preview`)
    expect(noAthlete.status).toBe(400)
    expect(noAthlete.data.data?.fields?.athleteId).toBeTruthy()
  })
})
