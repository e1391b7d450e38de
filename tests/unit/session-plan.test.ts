import { describe, expect, it } from 'vitest'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import { trainingPaces } from '../../shared/utils/pace'
import { planSession, segmentKey } from '../../shared/utils/session-plan'

const snapshot: AssignmentSnapshot = {
  title: 'Hills and legs',
  category: 'mixed',
  description: '',
  exercises: [
    { id: 1, name: 'Back squat', category: 'strength', summary: '', cues: [], equipment: ['Barbell', 'Rack'], cautions: [{ text: 'Brace before each rep.', bodyAreas: ['lower_back'] }] },
    { id: 2, name: 'Hill run', category: 'hill', summary: '', cues: [], equipment: [], cautions: [{ text: 'Shorten the stride on the steepest part.', bodyAreas: ['achilles', 'calf'] }] },
    { id: 3, name: 'Unused', category: 'plyometric', summary: '', cues: [], equipment: ['Box'], cautions: [{ text: 'Land softly.', bodyAreas: ['achilles'] }] },
  ],
  steps: [
    { id: 'squat', type: 'sets', exerciseId: 1, sets: 3, perSet: { by: 'reps', reps: 5 }, restSeconds: 120, target: { type: 'percent1rm', percent: 80 } },
    { id: 'outer', type: 'repeat', times: 2, steps: [
      { id: 'inner', type: 'repeat', times: 3, steps: [
        { id: 'up', type: 'block', kind: 'work', exerciseId: 2, measure: { by: 'time', seconds: 45 }, grade: 0.08, target: { type: 'pace', zone: 'fiveK' } },
        { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 } },
      ] },
    ] },
  ],
}

const paces = trainingPaces({ distanceM: 10_000, timeS: 40 * 60 })

describe('planSession', () => {
  it('fills in %1RM loads rounded to 2.5 kg and grade-adjusted paces', () => {
    // 80 % of an estimated 1RM of 101 kg is 80.8 kg, nearest 2.5 kg plate step 80 kg (common practice).
    const plan = planSession(snapshot, { paces, estimatedMaxKg: { 1: 101 }, injuryNotes: [] })
    const sets = plan.segments.filter(segment => segment.stepId === 'squat' && segment.kind === 'work')
    expect(sets.map(segment => segment.targetKg)).toEqual([80, 80, 80])
    expect(sets.every(segment => segment.manual && segment.loggable)).toBe(true)
    const up = plan.segments.find(segment => segment.stepId === 'up')!
    // Uphill at the same effort is slower than the flat 5K pace.
    expect(up.targetPaceSPerKm).toBeGreaterThan(paces.fiveK)
    expect(up.manual).toBe(false)
    expect(plan.missingMaxFor).toEqual([])
  })

  it('gives every segment a distinct key, nested repeats included', () => {
    const plan = planSession(snapshot, { paces: null, estimatedMaxKg: {}, injuryNotes: [] })
    const keys = plan.segments.map(segment => segment.key)
    expect(new Set(keys).size).toBe(keys.length)
    const ups = plan.segments.filter(segment => segment.stepId === 'up')
    expect(ups.map(segment => segment.round)).toEqual([1, 2, 3, 4, 5, 6])
    expect(ups.every(segment => segment.rounds === 6)).toBe(true)
    expect(plan.segments.filter(segment => segment.loggable)).toHaveLength(3 + 6)
    expect(plan.missingMaxFor).toEqual(['Back squat'])
  })

  it('keeps the cautions that concern active injury notes of exercises in the session', () => {
    const plan = planSession(snapshot, { paces: null, estimatedMaxKg: {}, injuryNotes: [{ bodyArea: 'achilles', status: 'active' }, { bodyArea: 'lower_back', status: 'resolved' }] })
    // The hill step's own caution (uphill → Achilles, calf) joins the exercise's.
    expect(plan.injuryCautions.map(caution => [caution.exerciseName, caution.matchedAreas])).toEqual([['Hill run', ['achilles']], ['Uphill efforts', ['achilles']]])
    expect(plan.segments.find(segment => segment.stepId === 'up')!.stepCautions).toEqual(['uphill'])
    expect(plan.equipment).toEqual(['Barbell', 'Rack'])
    expect(plan.generalCautions.some(text => /downhill/.test(text))).toBe(true)
    expect(plan.generalCautions.some(text => /Land softly/.test(text))).toBe(false)
  })
})

describe('segmentKey', () => {
  it('spells a logged entry the same way as the plan spells its work segment', () => {
    const plan = planSession(snapshot, { paces: null, estimatedMaxKg: {}, injuryNotes: [] })
    for (const segment of plan.segments.filter(item => item.loggable)) {
      expect(segmentKey({ stepId: segment.stepId, round: segment.round, set: segment.set })).toBe(segment.key)
    }
  })

  it('keeps rests apart from the work of the same set', () => {
    expect(segmentKey({ stepId: 'squat', round: null, set: 2 })).toBe('squat:0:2')
    expect(segmentKey({ stepId: 'squat', round: null, set: 2, kind: 'rest' })).toBe('squat:0:2:rest')
  })
})
