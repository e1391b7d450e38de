import { describe, expect, it } from 'vitest'
import { cautionsForStep, generalCautions, heavySetNote, matchCautions, routineStepCautions, stepCautionsFor, stepCautionTable } from '../../shared/utils/cautions'
import { loadForPercent } from '../../shared/utils/strength'
import { routineStepsSchema, type RoutineStep } from '../../shared/schemas/routine-steps'

// The body-area table is common practice, no published source: these tests pin the mapping the
// issue asks for, so a change to it is a deliberate one.

describe('stepCautionTable', () => {
  it('maps each kind of step to the body areas it loads', () => {
    expect(Object.fromEntries(Object.entries(stepCautionTable).map(([key, entry]) => [key, [...entry.bodyAreas]]))).toEqual({
      uphill: ['achilles', 'calf'],
      downhill: ['knee', 'shin', 'quad'],
      fast: ['hamstring'],
      jumps: ['achilles', 'knee', 'foot'],
      heavy: ['lower_back'],
    })
  })
})

describe('stepCautionsFor', () => {
  it('reads uphill and downhill from the grade', () => {
    expect(stepCautionsFor({ kind: 'work', grade: 0.06 })).toEqual(['uphill'])
    expect(stepCautionsFor({ kind: 'recovery', grade: -0.06 })).toEqual(['downhill'])
    // Jogging back up between efforts is not an uphill effort.
    expect(stepCautionsFor({ kind: 'recovery', grade: 0.06 })).toEqual([])
    expect(stepCautionsFor({ kind: 'work', grade: 0 })).toEqual([])
  })

  it('treats a hill exercise without a grade as a climb', () => {
    expect(stepCautionsFor({ kind: 'work', exerciseCategory: 'hill' })).toEqual(['uphill'])
  })

  it('flags fast running: strides, and mile or 5K pace on the flat', () => {
    expect(stepCautionsFor({ kind: 'work', exerciseCategory: 'stride' })).toEqual(['fast'])
    expect(stepCautionsFor({ kind: 'work', target: { type: 'pace', zone: 'mile' } })).toEqual(['fast'])
    expect(stepCautionsFor({ kind: 'work', target: { type: 'pace', zone: 'threshold' } })).toEqual([])
    expect(stepCautionsFor({ kind: 'work', grade: 0.08, target: { type: 'pace', zone: 'fiveK' } })).toEqual(['uphill'])
  })

  it('flags jumps and heavy lifts from 85 % of 1RM', () => {
    expect(stepCautionsFor({ exerciseCategory: 'plyometric' })).toEqual(['jumps'])
    expect(stepCautionsFor({ target: { type: 'percent1rm', percent: 84 } })).toEqual([])
    expect(stepCautionsFor({ target: { type: 'percent1rm', percent: 85 } })).toEqual(['heavy'])
  })
})

const hillRoutine: RoutineStep[] = [
  { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 600 } },
  { id: 'reps', type: 'repeat', times: 8, steps: [
    { id: 'up', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 }, grade: 0.06 },
    { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 }, grade: -0.06 },
  ] },
]

describe('matchCautions with steps', () => {
  it('lists the uphill caution first for an athlete with an active Achilles note', () => {
    const cautions = matchCautions([], [{ bodyArea: 'achilles', status: 'active' }], hillRoutine)
    expect(cautions.map(caution => [caution.source, caution.exerciseName, caution.matchedAreas])).toEqual([
      ['step', 'Uphill efforts', ['achilles']],
      ['step', 'Downhill running', []],
    ])
  })

  it('ignores resolved notes', () => {
    const cautions = matchCautions([], [{ bodyArea: 'achilles', status: 'resolved' }], hillRoutine)
    expect(cautions.every(caution => caution.matchedAreas.length === 0)).toBe(true)
  })

  it('finds the steps inside repeats once each', () => {
    expect(routineStepCautions(hillRoutine, () => undefined)).toEqual(['uphill', 'downhill'])
  })
})

describe('cautionsForStep', () => {
  it('puts the cautions touching an injury note first, exercise and step alike', () => {
    const lines = cautionsForStep([{ text: 'Keep the hips level.', bodyAreas: ['hip'] }], ['uphill'], [{ bodyArea: 'calf', status: 'active' }])
    expect(lines).toEqual([
      { text: stepCautionTable.uphill.text, concernsYou: true },
      { text: 'Keep the hips level.', concernsYou: false },
    ])
  })
})

describe('the %1RM cap', () => {
  const sets = (percent: number): RoutineStep[] => [{ id: 's', type: 'sets', exerciseId: 1, sets: 3, perSet: { by: 'reps', reps: 3 }, restSeconds: 120, target: { type: 'percent1rm', percent } }]

  it('accepts targets up to 100 % and refuses more', () => {
    expect(routineStepsSchema.safeParse(sets(100)).success).toBe(true)
    const over = routineStepsSchema.safeParse(sets(101))
    expect(over.success).toBe(false)
    expect(over.error?.issues[0]?.message).toBe('Percent of 1RM is at most 100')
  })

  it('never computes a load above the estimated 1RM', () => {
    expect(loadForPercent(100, 100)).toBe(100)
    expect(() => loadForPercent(100, 101)).toThrow(RangeError)
  })

  it('notes supervision with a spotter from 85 %', () => {
    expect(heavySetNote(84)).toBeNull()
    expect(heavySetNote(85)).toMatch(/supervised session, with a spotter/)
  })
})

describe('generalCautions', () => {
  it('always keeps the cautions every card must show', () => {
    const texts = generalCautions(['strength'])
    expect(texts.some(text => /Stop if you feel sharp pain/.test(text))).toBe(true)
    expect(texts.some(text => /clearance from a licensed clinician/.test(text))).toBe(true)
  })
})
