import { beforeAll, describe, expect, it } from 'vitest'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import type { FieldError } from '../support/client'
import { addAthlete, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'
import type { FinishedSession, LoggedEntry, Logbook, ProfileView, SessionPlan, StartedSession } from '../../types/api'

const running = useStack()
let team: Awaited<ReturnType<typeof registerCoach>>
let athlete: Awaited<ReturnType<typeof addAthlete>>
let teammate: Awaited<ReturnType<typeof addAthlete>>
let otherTeam: Awaited<ReturnType<typeof registerCoach>>
let outsider: Awaited<ReturnType<typeof addAthlete>>
let snapshot: AssignmentSnapshot

beforeAll(async () => {
  team = await registerCoach(running.stack)
  athlete = await addAthlete(running.stack, team.coach, { name: 'Ffion Aske' })
  teammate = await addAthlete(running.stack, team.coach, { name: 'Cai Penhallow' })
  otherTeam = await registerCoach(running.stack, 'Brackenmoor Harriers')
  outsider = await addAthlete(running.stack, otherTeam.coach, { name: 'Ilse Marr' })

  const squat = await running.fixtures.exercise(team.teamId, {
    name: 'Goblet squat',
    cues: ['Elbows inside the knees', 'Sit between the heels'],
    equipment: ['Kettlebell'],
    cautions: [{ text: 'Keep knees tracking over the toes; stop on sharp knee pain.', bodyAreas: ['knee'] }],
  })
  const plank = await running.fixtures.exercise(team.teamId, { name: 'Front plank', equipment: ['Mat'], cautions: [{ text: 'Keep the lower back flat.', bodyAreas: ['lower_back'] }] })
  const hill = await running.fixtures.exercise(team.teamId, { name: 'Hill run', category: 'hill' })
  snapshot = {
    title: 'Knees and hills',
    category: 'mixed',
    description: 'Gym circuit then short hills',
    exercises: [squat, plank, hill],
    steps: [
      { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 300 } },
      { id: 'squat', type: 'sets', exerciseId: squat.id, sets: 3, perSet: { by: 'reps', reps: 8 }, restSeconds: 60, target: { type: 'percent1rm', percent: 70 } },
      { id: 'plank', type: 'block', kind: 'work', exerciseId: plank.id, measure: { by: 'time', seconds: 30 } },
      { id: 'hills', type: 'repeat', times: 2, skipLastRecovery: true, steps: [
        { id: 'up', type: 'block', kind: 'work', exerciseId: hill.id, measure: { by: 'distance', meters: 200 }, grade: 0.06, target: { type: 'pace', zone: 'fiveK' } },
        { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 } },
      ] },
    ],
  }
  await running.fixtures.injuryNote(team.teamId, athlete.userId, 'knee', 'Aches on descents')
  await athlete.athlete.patch('/api/me/profile', { benchmarkDistanceM: 5000, benchmarkTimeS: 20 * 60 })
})

async function assign() {
  return running.fixtures.assignment(team.teamId, athlete.userId, snapshot)
}

describe('the session plan', () => {
  it('fills in paces, grade-adjusted hills and cautions matching the injury note', async () => {
    const { id } = await assign()
    const response = await athlete.athlete.get<SessionPlan>(`/api/assignments/${id}/plan`)
    expect(response.status).toBe(200)
    const { plan } = response.data
    const logged = plan.segments.filter(segment => segment.loggable)
    // 3 squat sets, the plank, 2 hill reps.
    expect(logged).toHaveLength(6)
    const up = plan.segments.find(segment => segment.stepId === 'up')!
    expect(up.manual).toBe(true)
    expect(up.grade).toBe(0.06)
    // 20:00 for 5K is 240 s/km on the flat; uphill at the same effort is slower.
    expect(up.targetPaceSPerKm).toBeGreaterThan(240)
    expect(plan.injuryCautions.map(caution => caution.text)).toEqual(['Keep knees tracking over the toes; stop on sharp knee pain.'])
    expect(plan.injuryCautions[0]!.matchedAreas).toEqual(['knee'])
    expect(plan.generalCautions.some(text => /downhill/i.test(text))).toBe(true)
    expect(plan.equipment).toEqual(['Kettlebell', 'Mat'])
    // No logged squats yet: no 1RM to take 70 % of.
    expect(plan.missingMaxFor).toEqual(['Goblet squat'])
    expect(plan.segments.find(segment => segment.stepId === 'squat')!.targetKg).toBeNull()
  })

  it('is only for the assigned athlete', async () => {
    const { id } = await assign()
    expect((await teammate.athlete.get(`/api/assignments/${id}/plan`)).status).toBe(404)
    expect((await team.coach.get(`/api/assignments/${id}/plan`)).status).toBe(403)
    expect((await outsider.athlete.get(`/api/assignments/${id}/plan`)).status).toBe(404)
    expect((await athlete.athlete.get('/api/assignments/999999/plan')).status).toBe(404)
    expect((await athlete.athlete.get('/api/assignments/abc/plan')).status).toBe(400)
  })
})

describe('logging a session', () => {
  it('starts once per clientId, and only for the assigned athlete', async () => {
    const { id } = await assign()
    const first = await athlete.athlete.post<StartedSession>(`/api/assignments/${id}/sessions`, { clientId: 'client-start-1' })
    expect(first.status).toBe(201)
    const again = await athlete.athlete.post<StartedSession>(`/api/assignments/${id}/sessions`, { clientId: 'client-start-1' })
    expect(again.status).toBe(200)
    expect(again.data.id).toBe(first.data.id)
    expect((await teammate.athlete.post(`/api/assignments/${id}/sessions`, { clientId: 'client-start-2' })).status).toBe(404)
    expect((await outsider.athlete.post(`/api/assignments/${id}/sessions`, { clientId: 'client-start-3' })).status).toBe(404)
    expect((await team.coach.post(`/api/assignments/${id}/sessions`, { clientId: 'client-start-4' })).status).toBe(403)
    const bad = await athlete.athlete.post<FieldError>(`/api/assignments/${id}/sessions`, { clientId: 'x' })
    expect(bad.status).toBe(400)
    expect(bad.data.data?.fields?.clientId).toMatch(/at least 8/)
    const other = await assign()
    const reused = await athlete.athlete.post<FieldError>(`/api/assignments/${other.id}/sessions`, { clientId: 'client-start-1' })
    expect(reused.status).toBe(409)
  })

  it('stores a repeated entry once and answers the first result', async () => {
    const { id } = await assign()
    const session = (await athlete.athlete.post<StartedSession>(`/api/assignments/${id}/sessions`, { clientId: 'client-idem-1' })).data
    const body = { idempotencyKey: 'client-idem-1:squat:0:1', stepId: 'squat', set: 1, reps: 8, kg: 24 }
    const first = await athlete.athlete.post<LoggedEntry>(`/api/sessions/${session.id}/entries`, body)
    expect(first.status).toBe(201)
    expect(first.data.exerciseId).toBe(snapshot.exercises[0]!.id)
    const retry = await athlete.athlete.post<LoggedEntry>(`/api/sessions/${session.id}/entries`, { ...body, reps: 5, kg: 30 })
    expect(retry.status).toBe(200)
    expect(retry.data).toMatchObject({ id: first.data.id, reps: 8, kg: 24 })
    const parallel = await Promise.all(Array.from({ length: 5 }, () => athlete.athlete.post<LoggedEntry>(`/api/sessions/${session.id}/entries`, { ...body, idempotencyKey: 'client-idem-1:squat:0:2', set: 2 })))
    expect(new Set(parallel.map(response => response.data.id)).size).toBe(1)
    expect(parallel.filter(response => response.status === 201).length).toBeLessThanOrEqual(1)
    const rows = await running.fixtures.rows<{ n: number }>('select count(*) as n from entry_logs where session_id = ?', [session.id])
    expect(Number(rows[0]!.n)).toBe(2)
  })

  it('refuses impossible values with field messages', async () => {
    const { id } = await assign()
    const session = (await athlete.athlete.post<StartedSession>(`/api/assignments/${id}/sessions`, { clientId: 'client-bad-1' })).data
    const post = (body: object) => athlete.athlete.post<FieldError>(`/api/sessions/${session.id}/entries`, { idempotencyKey: `bad-${Math.random().toString(36).slice(2)}`, stepId: 'squat', set: 1, ...body })
    expect((await post({ reps: -1 })).data.data?.fields?.reps).toMatch(/negative/)
    expect((await post({ kg: 2000 })).data.data?.fields?.kg).toMatch(/500 kg/)
    expect((await post({ rpe: 11 })).data.data?.fields?.rpe).toMatch(/0 to 10/)
    expect((await post({ stepId: 'plank', set: undefined, seconds: 90_000 })).data.data?.fields?.seconds).toMatch(/day/)
    expect((await post({ reps: 2.5 })).status).toBe(400)
    const unknown = await post({ stepId: 'nope' })
    expect(unknown.status).toBe(400)
    expect(unknown.data.data?.fields?.stepId).toMatch(/no such set/)
    // A warm-up is not something to log.
    expect((await post({ stepId: 'warm', set: undefined, seconds: 300 })).status).toBe(400)
    const malformed = await athlete.athlete.request('POST', `/api/sessions/${session.id}/entries`, undefined, { raw: '{"reps":' })
    expect(malformed.status).toBe(400)
    const rows = await running.fixtures.rows<{ n: number }>('select count(*) as n from entry_logs where session_id = ?', [session.id])
    expect(Number(rows[0]!.n)).toBe(0)
  })

  it('lets only the session\'s athlete log into it', async () => {
    const { id } = await assign()
    const session = (await athlete.athlete.post<StartedSession>(`/api/assignments/${id}/sessions`, { clientId: 'client-scope-1' })).data
    const body = { idempotencyKey: 'client-scope-1:plank:0:0', stepId: 'plank', seconds: 30 }
    expect((await teammate.athlete.post(`/api/sessions/${session.id}/entries`, body)).status).toBe(404)
    expect((await team.coach.post(`/api/sessions/${session.id}/entries`, body)).status).toBe(403)
    expect((await outsider.athlete.post(`/api/sessions/${session.id}/entries`, body)).status).toBe(404)
    expect((await teammate.athlete.post(`/api/sessions/${session.id}/finish`, { sessionRpe: 5 })).status).toBe(404)
    expect((await athlete.athlete.post(`/api/sessions/${session.id}/entries`, body)).status).toBe(201)
    // Coaches of the team read it; other people get the same 404 as for a missing session.
    expect((await team.coach.get(`/api/sessions/${session.id}`)).status).toBe(200)
    expect((await teammate.athlete.get(`/api/sessions/${session.id}`)).status).toBe(404)
    expect((await otherTeam.coach.get(`/api/sessions/${session.id}`)).status).toBe(404)
  })

  it('finishes with the session load, the local day, a pain flag and the assignment marked done', async () => {
    const { id } = await assign()
    const session = (await athlete.athlete.post<StartedSession>(`/api/assignments/${id}/sessions`, { clientId: 'client-full-1' })).data
    const plan = (await athlete.athlete.get<SessionPlan>(`/api/assignments/${id}/plan`)).data.plan
    for (const segment of plan.segments.filter(item => item.loggable)) {
      const values = segment.stepId === 'squat' ? { reps: 8, kg: 40 } : segment.stepId === 'plank' ? { seconds: 30 } : { seconds: 55, meters: 200 }
      const response = await athlete.athlete.post(`/api/sessions/${session.id}/entries`, {
        idempotencyKey: `client-full-1:${segment.key}`,
        stepId: segment.stepId,
        set: segment.set ?? undefined,
        round: segment.round ?? undefined,
        ...values,
      })
      expect(response.status).toBe(201)
    }
    const missingArea = await athlete.athlete.post<FieldError>(`/api/sessions/${session.id}/finish`, { sessionRpe: 6, pain: 5 })
    expect(missingArea.data.data?.fields?.painArea).toMatch(/where it hurts/)
    expect((await athlete.athlete.post<FieldError>(`/api/sessions/${session.id}/finish`, { sessionRpe: 11 })).status).toBe(400)
    const finished = await athlete.athlete.post<FinishedSession>(`/api/sessions/${session.id}/finish`, { sessionRpe: 6, pain: 5, painArea: 'knee', note: 'Knee grumbled on the second hill', durationS: 1800 })
    expect(finished.status).toBe(200)
    expect(finished.data.status).toBe('done')
    // Foster et al. (2001): session RPE × minutes = 6 × 30.
    expect(finished.data.session.load).toBe(180)
    expect(finished.data.session.day).toMatch(/^\d{4}-\d{2}-\d{2}$/)
    expect(finished.data.flags).toMatchObject([{ reason: 'high_pain', pain: 5, area: 'knee' }])
    const [assignment] = await running.fixtures.rows<{ status: string }>('select status from assignments where id = ?', [id])
    expect(assignment!.status).toBe('done')
    // Finishing again changes nothing and raises no second flag.
    const again = await athlete.athlete.post<FinishedSession>(`/api/sessions/${session.id}/finish`, { sessionRpe: 2 })
    expect(again.status).toBe(200)
    expect(again.data.session.load).toBe(180)
    const flags = await running.fixtures.rows('select * from pain_flags where session_id = ?', [session.id])
    expect(flags).toHaveLength(1)
  })

  it('flags a new pain area but not a known one, and marks a session with missing sets partial', async () => {
    const known = await assign()
    const first = (await athlete.athlete.post<StartedSession>(`/api/assignments/${known.id}/sessions`, { clientId: 'client-area-1' })).data
    const quiet = await athlete.athlete.post<{ flags: unknown[], status: string }>(`/api/sessions/${first.id}/finish`, { sessionRpe: 4, pain: 2, painArea: 'knee' })
    expect(quiet.data.flags).toEqual([])
    expect(quiet.data.status).toBe('partial')
    const next = await assign()
    const second = (await athlete.athlete.post<StartedSession>(`/api/assignments/${next.id}/sessions`, { clientId: 'client-area-2' })).data
    const fresh = await athlete.athlete.post<{ flags: { reason: string }[] }>(`/api/sessions/${second.id}/finish`, { sessionRpe: 4, pain: 2, painArea: 'shoulder' })
    expect(fresh.data.flags).toMatchObject([{ reason: 'new_area' }])
    // The shoulder is known now: a later report of it is not new.
    const third = await assign()
    const later = (await athlete.athlete.post<StartedSession>(`/api/assignments/${third.id}/sessions`, { clientId: 'client-area-3' })).data
    const repeat = await athlete.athlete.post<{ flags: unknown[] }>(`/api/sessions/${later.id}/finish`, { sessionRpe: 3, pain: 1, painArea: 'shoulder' })
    expect(repeat.data.flags).toEqual([])
  })

  it('uses logged sets for the next %1RM load, rounded to 2.5 kg', async () => {
    const { id } = await assign()
    const plan = (await athlete.athlete.get<SessionPlan>(`/api/assignments/${id}/plan`)).data.plan
    // Best logged squat so far: 8 × 40 kg, Epley (1985) 40 × (1 + 8/30) = 50.7 kg; 70 % = 35.5 → 35 kg.
    expect(plan.segments.find(segment => segment.stepId === 'squat')!.targetKg).toBe(35)
    expect(plan.missingMaxFor).toEqual([])
  })
})

describe('the routine card link', () => {
  it('finds the athlete\'s next planned session of a routine', async () => {
    const today = new Date().toISOString().slice(0, 10)
    const routineId = await running.fixtures.routine(team.teamId, { title: 'Card routine', steps: snapshot.steps })
    const later = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot, { routineId, date: '2099-01-10' })
    const sooner = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot, { routineId, date: '2099-01-03' })
    await running.fixtures.assignment(team.teamId, athlete.userId, snapshot, { routineId, date: today, status: 'done' })
    const next = await athlete.athlete.get<{ id: number }>(`/api/me/next-assignment?routineId=${routineId}`)
    expect(next.status).toBe(200)
    expect(next.data.id).toBe(sooner.id)
    expect(later.id).not.toBe(sooner.id)
    expect((await teammate.athlete.get(`/api/me/next-assignment?routineId=${routineId}`)).status).toBe(404)
    expect((await athlete.athlete.get('/api/me/next-assignment?routineId=x')).status).toBe(400)
  })
})

describe('the logbook', () => {
  it('lists sessions with their sets by date range, for the athlete and their coaches', async () => {
    const { id } = await assign()
    const session = (await athlete.athlete.post<StartedSession>(`/api/assignments/${id}/sessions`, { clientId: 'client-book-1' })).data
    await athlete.athlete.post(`/api/sessions/${session.id}/entries`, { idempotencyKey: 'client-book-1:plank', stepId: 'plank', seconds: 28 })
    const mine = await athlete.athlete.get<Logbook>(`/api/me/logbook?from=${session.day}&to=${session.day}`)
    expect(mine.status).toBe(200)
    const found = mine.data.sessions.find(item => item.id === session.id)!
    expect(found.routine.title).toBe('Knees and hills')
    expect(found.entries.map(entry => entry.seconds)).toEqual([28])
    const before = await athlete.athlete.get<{ sessions: unknown[] }>('/api/me/logbook?from=2020-01-01&to=2020-01-31')
    expect(before.data.sessions).toEqual([])
    expect((await athlete.athlete.get<FieldError>('/api/me/logbook?from=2026-02-30')).status).toBe(400)
    expect((await athlete.athlete.get<FieldError>('/api/me/logbook?from=2026-03-02&to=2026-03-01')).data.data?.fields?.to).toMatch(/before/)
    const coachView = await team.coach.get<{ sessions: { id: number }[] }>(`/api/athletes/${athlete.userId}/logbook`)
    expect(coachView.status).toBe(200)
    expect(coachView.data.sessions.some(item => item.id === session.id)).toBe(true)
    expect((await otherTeam.coach.get(`/api/athletes/${athlete.userId}/logbook`)).status).toBe(404)
    expect((await teammate.athlete.get(`/api/athletes/${athlete.userId}/logbook`)).status).toBe(403)
    const theirs = await teammate.athlete.get<{ sessions: { id: number }[] }>('/api/me/logbook')
    expect(theirs.data.sessions.some(item => item.id === session.id)).toBe(false)
  })

  it('edits an entry within 7 days only, by its athlete', async () => {
    const { id } = await assign()
    const session = (await athlete.athlete.post<StartedSession>(`/api/assignments/${id}/sessions`, { clientId: 'client-edit-1' })).data
    const entry = (await athlete.athlete.post<LoggedEntry>(`/api/sessions/${session.id}/entries`, { idempotencyKey: 'client-edit-1:squat:1', stepId: 'squat', set: 1, reps: 8, kg: 20 })).data
    const edited = await athlete.athlete.patch<LoggedEntry>(`/api/entries/${entry.id}`, { reps: 6, kg: 22.5 })
    expect(edited.status).toBe(200)
    expect(edited.data).toMatchObject({ reps: 6, kg: 22.5 })
    expect((await athlete.athlete.patch<FieldError>(`/api/entries/${entry.id}`, { kg: 2000 })).data.data?.fields?.kg).toMatch(/500/)
    expect((await athlete.athlete.patch(`/api/entries/${entry.id}`, {})).status).toBe(400)
    expect((await teammate.athlete.patch(`/api/entries/${entry.id}`, { reps: 1 })).status).toBe(404)
    expect((await team.coach.patch(`/api/entries/${entry.id}`, { reps: 1 })).status).toBe(403)
    await running.fixtures.rows('update session_logs set started_at = ? where id = ?', [Date.now() - 8 * 86_400_000, session.id])
    const late = await athlete.athlete.patch<FieldError>(`/api/entries/${entry.id}`, { reps: 7 })
    expect(late.status).toBe(409)
    expect(late.data.message).toMatch(/7 days/)
    const [row] = await running.fixtures.rows<{ reps: number }>('select reps from entry_logs where id = ?', [entry.id])
    expect(row!.reps).toBe(6)
  })
})

describe('the athlete profile', () => {
  it('saves benchmark, heart rate and units, and names the HRmax estimate', async () => {
    const patched = await teammate.athlete.patch<ProfileView>('/api/me/profile', { benchmarkDistanceM: 10_000, benchmarkTimeS: 2400, benchmarkDate: '2026-09-20', birthYear: 1990, hrRest: 50, units: 'mi' })
    expect(patched.status).toBe(200)
    expect(patched.data.profile).toMatchObject({ benchmarkDistanceM: 10_000, units: 'mi', hrMax: null })
    // A 40:00 10K predicts itself: 240 s/km.
    expect(patched.data.derived.paces!.tenK).toBeCloseTo(240, 0)
    const age = new Date().getUTCFullYear() - 1990
    // Tanaka, Monahan & Seals (2001): 208 − 0.7 × age.
    expect(patched.data.derived.hrMaxEstimate).toBe(Math.round(208 - 0.7 * age))
    expect(patched.data.derived.hrMaxSource).toBe('estimate')
    const measured = await teammate.athlete.patch<ProfileView>('/api/me/profile', { hrMax: 191 })
    expect(measured.data.derived).toMatchObject({ hrMax: 191, hrMaxSource: 'measured' })
    const bad = await teammate.athlete.patch<FieldError>('/api/me/profile', { hrMax: 300, hrRest: 10, units: 'furlong', benchmarkDate: '2026-13-01' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.data.data?.fields ?? {})).toEqual(expect.arrayContaining(['hrMax', 'hrRest', 'units', 'benchmarkDate']))
    expect((await teammate.athlete.get<ProfileView>('/api/me/profile')).data.profile.hrMax).toBe(191)
    const refused = await team.coach.get<FieldError>('/api/me/profile')
    expect(refused.status).toBe(403)
    // Every refusal has the same shape: a summary and (possibly empty) field messages.
    expect(refused.data).toMatchObject({ statusCode: 403, data: { message: expect.stringMatching(/for athletes/), fields: {} } })
    for (const path of ['/api/me/pain-flags', '/api/me/assignments', '/api/me/logbook', '/api/me/notifications', '/api/me/paces', '/api/me/insights', '/api/me/calendar-feed']) {
      expect((await team.coach.get(path)).status, path).toBe(403)
    }
  })

  it('adds and resolves injury notes', async () => {
    const added = await teammate.athlete.post<{ id: number, status: string }>('/api/me/injury-notes', { bodyArea: 'achilles', note: 'Stiff in the mornings', since: '2026-11-10' })
    expect(added.status).toBe(201)
    expect(added.data.status).toBe('active')
    expect((await teammate.athlete.post<FieldError>('/api/me/injury-notes', { bodyArea: 'elbow' })).data.data?.fields?.bodyArea).toMatch(/body area/)
    const resolved = await teammate.athlete.patch<{ status: string }>(`/api/injury-notes/${added.data.id}`, { status: 'resolved' })
    expect(resolved.data.status).toBe('resolved')
    expect((await athlete.athlete.patch(`/api/injury-notes/${added.data.id}`, { status: 'active' })).status).toBe(404)
    expect((await otherTeam.coach.patch(`/api/injury-notes/${added.data.id}`, { status: 'active' })).status).toBe(404)
    expect((await team.coach.patch(`/api/injury-notes/${added.data.id}`, { note: 'Checked by the physio' })).status).toBe(200)
    const profile = await teammate.athlete.get<ProfileView>('/api/me/profile')
    expect(profile.data.injuryNotes).toMatchObject([{ bodyArea: 'achilles', status: 'resolved' }])
  })

  it('is readable and editable by the team\'s coaches only', async () => {
    const read = await team.coach.get<ProfileView>(`/api/athletes/${athlete.userId}/profile`)
    expect(read.status).toBe(200)
    expect(read.data.injuryNotes.some(note => note.bodyArea === 'knee')).toBe(true)
    const edited = await team.coach.patch<ProfileView>(`/api/athletes/${athlete.userId}/profile`, { units: 'mi' })
    expect(edited.data.profile.units).toBe('mi')
    expect((await otherTeam.coach.get(`/api/athletes/${athlete.userId}/profile`)).status).toBe(404)
    expect((await otherTeam.coach.patch(`/api/athletes/${athlete.userId}/profile`, { units: 'km' })).status).toBe(404)
    expect((await teammate.athlete.get(`/api/athletes/${athlete.userId}/profile`)).status).toBe(403)
    expect((await team.coach.get(`/api/athletes/${team.userId}/profile`)).status).toBe(404)
    const note = await team.coach.post<{ id: number }>(`/api/athletes/${athlete.userId}/injury-notes`, { bodyArea: 'hip', note: 'Tight after long runs' })
    expect(note.status).toBe(201)
    const [row] = await running.fixtures.rows<{ units: string }>('select units from athlete_profiles where user_id = ?', [athlete.userId])
    expect(row!.units).toBe('mi')
  })
})
