import { beforeAll, describe, expect, it } from 'vitest'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import type { ApiClient, FieldError } from '../support/client'
import { addAthlete, addCoach, registerCoach } from '../support/team'
import { useStack } from '../support/hooks'
import type { RoutinePreview } from '../../shared/types/routine'
import type { FinishedSession } from '../../types/api'

const running = useStack()
let team: Awaited<ReturnType<typeof registerCoach>>
let secondCoach: { coach: ApiClient, email: string }
let athlete: Awaited<ReturnType<typeof addAthlete>>
let otherTeam: Awaited<ReturnType<typeof registerCoach>>
let snapshot: AssignmentSnapshot

/** Runs one session of the snapshot for the athlete and finishes it with the given report. */
async function finishWith(report: Record<string, unknown>) {
  const { id } = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot)
  const started = await athlete.athlete.post<{ id: number }>(`/api/assignments/${id}/sessions`, { clientId: `client-${Math.random().toString(36).slice(2, 12)}` })
  return athlete.athlete.post<FinishedSession>(`/api/sessions/${started.data.id}/finish`, { sessionRpe: 6, ...report })
}

async function outboxTo(address: string) {
  return running.fixtures.rows<{ template: string, payload: string }>('select template, payload from email_outbox where "to" = ? and template = ?', [address, 'pain_flag_raised'])
}

beforeAll(async () => {
  team = await registerCoach(running.stack)
  secondCoach = await addCoach(running.stack, team.coach)
  athlete = await addAthlete(running.stack, team.coach, { name: 'Tamsin Rook' })
  otherTeam = await registerCoach(running.stack, 'Quenmere Striders')
  const hill = await running.fixtures.exercise(team.teamId, { name: 'One-minute hill climbs', category: 'hill' })
  snapshot = {
    title: 'Short hills',
    category: 'hills',
    description: '',
    exercises: [hill],
    steps: [
      { id: 'up', type: 'block', kind: 'work', exerciseId: hill.id, measure: { by: 'time', seconds: 60 }, grade: 0.06 },
      { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 } },
    ],
  }
})

describe('pain reports reach the coaches', () => {
  it('queues one e-mail per coach for a new pain flag, in words', async () => {
    const finished = await finishWith({ pain: 5, painArea: 'quad' })
    expect(finished.status).toBe(200)
    expect(finished.data.flags).toHaveLength(1)
    const [first, second] = await Promise.all([running.stack.mail.waitFor(team.email, /Pain report/), running.stack.mail.waitFor(secondCoach.email, /Pain report/)])
    expect(first.subject).toBe('Pain report: Tamsin Rook, 5/10 (thigh (quadriceps))')
    expect(first.text).toMatch(/reported pain of 5 out of 10/)
    expect(first.text).not.toMatch(/\bquad\b/)
    expect(second.subject).toBe(first.subject)
    expect(await outboxTo(team.email)).toHaveLength(1)
    expect(await outboxTo(secondCoach.email)).toHaveLength(1)
    // Nobody outside the team hears of it.
    expect(await outboxTo(otherTeam.email)).toHaveLength(0)
  })

  it('sends none to a coach who turned the e-mails off, and counts the open flags', async () => {
    const before = (await team.coach.get<{ open: number }>('/api/pain-flags/open-count')).data.open
    const off = await secondCoach.coach.put<{ painFlagEmails: boolean }>('/api/me/pain-flag-emails', { painFlagEmails: false })
    expect(off.status).toBe(200)
    expect((await secondCoach.coach.get<{ painFlagEmails: boolean }>('/api/team/safety')).data.painFlagEmails).toBe(false)
    expect((await secondCoach.coach.put<FieldError>('/api/me/pain-flag-emails', { painFlagEmails: 'no' })).status).toBe(400)
    expect((await athlete.athlete.put('/api/me/pain-flag-emails', { painFlagEmails: false })).status).toBe(403)

    const finished = await finishWith({ pain: 6, painArea: 'calf' })
    expect(finished.data.flags).toHaveLength(1)
    await running.stack.mail.waitFor(team.email, /6\/10 \(calf\)/)
    expect(await outboxTo(team.email)).toHaveLength(2)
    expect(await outboxTo(secondCoach.email)).toHaveLength(1)
    expect((await team.coach.get<{ open: number }>('/api/pain-flags/open-count')).data.open).toBe(before + 1)
    expect((await athlete.athlete.get('/api/pain-flags/open-count')).status).toBe(403)
    // The e-mails and the flag are written together; no flag, no e-mail.
    const quiet = await finishWith({ pain: 0 })
    expect(quiet.data.flags).toHaveLength(0)
    expect(await outboxTo(team.email)).toHaveLength(2)
  })
})

describe('urgent guidance', () => {
  it('is returned for pain of 7 or more, with the local emergency number when the team has none', async () => {
    const finished = await finishWith({ pain: 7, painArea: 'knee' })
    expect(finished.data.urgent).toBe(true)
    expect(finished.data.guidance!.title).toBe('Stop training now')
    expect(finished.data.guidance!.call).toMatch(/your local emergency number/)
    expect(finished.data.guidance!.redFlags).toEqual(expect.arrayContaining(['chest pain or tightness', 'being unable to bear weight']))
    const mild = await finishWith({ pain: 3, painArea: 'knee' })
    expect(mild.data.urgent).toBe(false)
    expect(mild.data.guidance).toBeNull()
  })

  it('names the team number, and treats sudden or sharp pain as urgent at any score', async () => {
    expect((await secondCoach.coach.put('/api/team/emergency-number', { emergencyNumber: '999' })).status).toBe(403)
    const bad = await team.coach.put<FieldError>('/api/team/emergency-number', { emergencyNumber: 'call me' })
    expect(bad.status).toBe(400)
    expect(bad.data.data?.fields?.emergencyNumber).toMatch(/digits/)
    expect((await team.coach.put('/api/team/emergency-number', { emergencyNumber: '112' })).status).toBe(200)
    const sudden = await finishWith({ pain: 2, painArea: 'hamstring', sudden: true })
    expect(sudden.data.urgent).toBe(true)
    expect(sudden.data.guidance!.call).toMatch(/the emergency number 112/)
    expect(sudden.data.flags.map(flag => [flag.reason, flag.sudden])).toEqual([['sudden', true]])
    const plan = await running.fixtures.assignment(team.teamId, athlete.userId, snapshot)
    expect((await athlete.athlete.get<{ team: { emergencyNumber: string } }>(`/api/assignments/${plan.id}/plan`)).data.team.emergencyNumber).toBe('112')
    expect((await team.coach.put('/api/team/emergency-number', { emergencyNumber: '' })).data).toEqual({ emergencyNumber: null })
  })
})

describe('cautions that follow the body', () => {
  it('lists the uphill caution in the preview of an uphill routine for an athlete with an Achilles note', async () => {
    const routineId = await running.fixtures.routine(team.teamId, { title: 'Eight uphill reps', category: 'hills', steps: [
      { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 600 } },
      { id: 'reps', type: 'repeat', times: 8, steps: [
        { id: 'up', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 }, grade: 0.06, target: { type: 'effort', rpe: 8 } },
        { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 } },
      ] },
    ] })
    const before = await team.coach.get<RoutinePreview>(`/api/routines/${routineId}/preview?athleteId=${athlete.userId}`)
    expect(before.data.cautions.find(caution => caution.exerciseName === 'Uphill efforts')!.matchedAreas).toEqual([])
    await running.fixtures.injuryNote(team.teamId, athlete.userId, 'achilles', 'Stiff in the mornings')
    const preview = await team.coach.get<RoutinePreview>(`/api/routines/${routineId}/preview?athleteId=${athlete.userId}`)
    expect(preview.status).toBe(200)
    expect(preview.data.cautions[0]).toMatchObject({ source: 'step', exerciseName: 'Uphill efforts', matchedAreas: ['achilles'] })
    expect(preview.data.cautions[0]!.text).toMatch(/Achilles/)
  })
})

describe('young athletes', () => {
  it('keeps a guardian contact, shows no age-based HRmax under 18 and flags the plan', async () => {
    const young = await addAthlete(running.stack, team.coach, { name: 'Wren Calder' })
    const birthYear = new Date().getUTCFullYear() - 16
    const saved = await young.athlete.patch<{ profile: { guardianContact: string }, derived: { under18: boolean, hrMaxEstimate: number | null } }>('/api/me/profile', { birthYear, guardianContact: 'Parent: Ada Calder, 01632 960000' })
    expect(saved.status).toBe(200)
    expect(saved.data.profile.guardianContact).toBe('Parent: Ada Calder, 01632 960000')
    expect(saved.data.derived.under18).toBe(true)
    expect(saved.data.derived.hrMaxEstimate).toBeNull()
    const { id } = await running.fixtures.assignment(team.teamId, young.userId, snapshot)
    expect((await young.athlete.get<{ athlete: { under18: boolean } }>(`/api/assignments/${id}/plan`)).data.athlete.under18).toBe(true)
    // An adult gets the Tanaka (2001) estimate, 208 − 0.7 × age: at 40, 180 bpm.
    const adult = await athlete.athlete.patch<{ derived: { under18: boolean, hrMaxEstimate: number | null } }>('/api/me/profile', { birthYear: new Date().getUTCFullYear() - 40 })
    expect(adult.data.derived.under18).toBe(false)
    expect(adult.data.derived.hrMaxEstimate).toBe(180)
  })
})
