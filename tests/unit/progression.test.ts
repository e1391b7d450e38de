import { describe, expect, it } from 'vitest'
import {
  baseValue, describeChanges, keyNumbers, planWeek, progressedValue, roundToPlates, ruleProblem, scaleVolume,
  taperWeeks, weekKind, weekOfBlock, type BlockShape, type ProgressionRule,
} from '../../shared/utils/progression'
import type { RoutineStep } from '../../shared/schemas/routine-steps'

// Progressions, lighter weeks and tapers are common coaching practice, no published source: these
// tests check the arithmetic the coach asked for, with every expected value worked out by hand below.

const hills: RoutineStep[] = [
  { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 600 } },
  {
    id: 'reps',
    type: 'repeat',
    times: 6,
    skipLastRecovery: true,
    steps: [
      { id: 'up', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 }, grade: 0.06, target: { type: 'effort', rpe: 8 } },
      { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 } },
    ],
  },
  { id: 'cool', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 600 } },
]

const gym: RoutineStep[] = [
  { id: 'squat', type: 'sets', exerciseId: 1, sets: 3, perSet: { by: 'reps', reps: 8 }, restSeconds: 90, target: { type: 'load', kg: 40 } },
  { id: 'deadlift', type: 'sets', exerciseId: 2, sets: 4, perSet: { by: 'reps', reps: 5 }, restSeconds: 120, target: { type: 'percent1rm', percent: 70 } },
  { id: 'tempo', type: 'block', kind: 'work', measure: { by: 'time', seconds: 1200 }, target: { type: 'effort', rpe: 6 } },
]

const roundsRule: ProgressionRule = { stepId: 'reps', field: 'rounds', by: 1, cap: 10 }
const eightWeeks: BlockShape = { weeks: 8, lighter: { weeks: [4], factor: 0.6 }, taper: { weeks: 1, factor: 0.6 } }

function rounds(steps: RoutineStep[]) {
  return (steps[1] as Extract<RoutineStep, { type: 'repeat' }>).times
}

describe('progressedValue: one rule, week by week', () => {
  it('adds a round a week and stops at the cap', () => {
    // 6 rounds in week 1, +1 a week: week n = 6 + (n − 1), capped at 10 → 6, 7, 8, 9, 10, 10, 10, 10.
    expect([1, 2, 3, 4, 5, 6, 7, 8].map(week => progressedValue(6, roundsRule, week))).toEqual([6, 7, 8, 9, 10, 10, 10, 10])
  })

  it('steps every k weeks', () => {
    // +2 reps every 2 weeks from 8: weeks 1–2 → 8, 3–4 → 10, 5–6 → 12.
    const rule: ProgressionRule = { stepId: 'squat', field: 'reps', by: 2, every: 2 }
    expect([1, 2, 3, 4, 5, 6].map(week => progressedValue(8, rule, week))).toEqual([8, 8, 10, 10, 12, 12])
  })

  it('adds kg and rounds to the team\'s plates', () => {
    // 40 kg + 2 kg a week with 2.5 kg plates: raw 40, 42, 44, 46 → nearest multiple of 2.5:
    // 42 / 2.5 = 16.8 → 17 → 42.5; 44 / 2.5 = 17.6 → 18 → 45; 46 / 2.5 = 18.4 → 18 → 45.
    const rule: ProgressionRule = { stepId: 'squat', field: 'loadKg', by: 2 }
    expect([1, 2, 3, 4].map(week => progressedValue(40, rule, week, 2.5))).toEqual([40, 42.5, 45, 45])
    // With 1 kg plates (0.5 kg each side) the same rule keeps the raw numbers: 40, 42, 44, 46.
    expect([1, 2, 3, 4].map(week => progressedValue(40, rule, week, 1))).toEqual([40, 42, 44, 46])
  })

  it('grows a load by a percentage, compounded, then rounds to plates', () => {
    // 40 kg × 1.05^(n−1): 40, 42, 44.1, 46.305 → 2.5 kg plates: 40, 42.5, 45, 47.5.
    const rule: ProgressionRule = { stepId: 'squat', field: 'loadKg', by: 5, mode: 'percent' }
    expect([1, 2, 3, 4].map(week => progressedValue(40, rule, week, 2.5))).toEqual([40, 42.5, 45, 47.5])
  })

  it('raises %1RM by points and never above 100', () => {
    // 70 % + 2.5 points a week, cap 100: week 13 would be 70 + 30 = 100, week 14 → 102.5 capped to 100.
    const rule: ProgressionRule = { stepId: 'deadlift', field: 'percent1rm', by: 2.5, cap: 100 }
    expect(progressedValue(70, rule, 2)).toBe(72.5)
    expect(progressedValue(70, rule, 13)).toBe(100)
    expect(progressedValue(70, rule, 14)).toBe(100)
  })

  it('rounds plates to the nearest step, never below one step', () => {
    // 41.2 / 2.5 = 16.48 → 16 × 2.5 = 40; 41.3 / 2.5 = 16.52 → 17 × 2.5 = 42.5; 0.9 → 2.5 (one step at least).
    expect(roundToPlates(41.2, 2.5)).toBe(40)
    expect(roundToPlates(41.3, 2.5)).toBe(42.5)
    expect(roundToPlates(0.9, 2.5)).toBe(2.5)
    // 1.25 kg total steps (two 0.625 kg fractional plates): 41.2 / 1.25 = 32.96 → 33 × 1.25 = 41.25.
    expect(roundToPlates(41.2, 1.25)).toBe(41.25)
  })
})

describe('week kinds: lighter weeks and the taper', () => {
  it('marks every k-th week lighter and the last weeks as taper', () => {
    // 12 weeks, every 3rd lighter (3, 6, 9, 12), 2-week taper (11, 12): 12 is taper, not lighter.
    const shape: BlockShape = { weeks: 12, lighter: { every: 3, factor: 0.7 }, taper: { weeks: 2, factor: 0.5 } }
    expect(Array.from({ length: 12 }, (_, index) => weekKind(index + 1, shape))).toEqual([
      'regular', 'regular', 'lighter', 'regular', 'regular', 'lighter', 'regular', 'regular', 'lighter', 'regular', 'taper', 'taper',
    ])
  })

  it('ends the taper with the race week when the race falls inside the block', () => {
    // Race in week 9 of 10, 3-week taper → weeks 7, 8, 9; week 10 (after the race) is regular.
    expect(taperWeeks({ weeks: 10, taper: { weeks: 3, factor: 0.6 }, raceWeek: 9 })).toEqual([7, 8, 9])
    expect(taperWeeks({ weeks: 10, taper: { weeks: 3, factor: 0.6 } })).toEqual([8, 9, 10])
  })

  it('numbers the weeks from the start date', () => {
    // Start Mon 2026-03-02: the 8th is day 6 → week 1, the 9th is day 7 → week 2; day 56 is past 8 weeks.
    expect(weekOfBlock('2026-03-02', 8, '2026-03-08')).toBe(1)
    expect(weekOfBlock('2026-03-02', 8, '2026-03-09')).toBe(2)
    expect(weekOfBlock('2026-03-02', 8, '2026-04-26')).toBe(8)
    expect(weekOfBlock('2026-03-02', 8, '2026-04-27')).toBeNull()
    expect(weekOfBlock('2026-03-02', 8, '2026-03-01')).toBeNull()
  })
})

describe('planWeek: the hill block from 6 to 10 rounds, lighter week 4, 1-week taper', () => {
  const plan = (week: number) => planWeek(hills, week, { rules: [roundsRule], shape: eightWeeks })

  it('gives each week its own rounds', () => {
    // Progression 6, 7, 8, 9, 10, 10, 10, 10; week 4 × 0.6 = 5.4 → 5; week 8 (taper) 10 × 0.6 = 6.
    expect([1, 2, 3, 4, 5, 6, 7, 8].map(week => rounds(plan(week).steps))).toEqual([6, 7, 8, 5, 10, 10, 10, 6])
    expect(plan(4).kind).toBe('lighter')
    expect(plan(8).kind).toBe('taper')
    expect(plan(2).kind).toBe('regular')
  })

  it('keeps intensity in a lighter or taper week', () => {
    // The hill rep stays 60 s at RPE 8 in the taper: only the number of rounds falls.
    const up = (plan(8).steps[1] as Extract<RoutineStep, { type: 'repeat' }>).steps[0]!
    expect(baseValue(up, 'seconds')).toBe(60)
    expect(baseValue(up, 'rpe')).toBe(8)
  })

  it('never changes the routine it was given', () => {
    plan(5)
    expect(rounds(hills)).toBe(6)
  })

  it('says what changed from last week', () => {
    expect(describeChanges(plan(1).steps, plan(2).steps)).toEqual(['+1 round'])
    // Week 3 → 4: 8 → 5 rounds.
    expect(describeChanges(plan(3).steps, plan(4).steps)).toEqual(['−3 rounds'])
    expect(describeChanges(plan(6).steps, plan(7).steps)).toEqual([])
  })

  it('lets the coach set a week by hand', () => {
    // Week 3 would be 8 rounds; the coach writes 7, and that wins over the rule.
    const week = planWeek(hills, 3, { rules: [roundsRule], shape: eightWeeks, overrides: [{ stepId: 'reps', field: 'rounds', value: 7 }] })
    expect(rounds(week.steps)).toBe(7)
    expect(week.overridden).toBe(true)
  })

  it('gives the week\'s key numbers', () => {
    // Week 2: 10 min warm-up + 7 × 60 s up + 6 × 90 s down (no recovery after the last) + 10 min cool-down
    // = 600 + 420 + 540 + 600 = 2160 s; work 420 s.
    const numbers = keyNumbers(plan(2).steps)
    expect(numbers).toMatchObject({ rounds: 7, durationS: 2160, workS: 420, loadKg: null, tonnageKg: 0 })
  })
})

describe('scaleVolume on a gym session', () => {
  it('scales sets and stand-alone work time, keeps reps and loads', () => {
    // × 0.7: squat 3 sets → 2.1 → 2; deadlift 4 → 2.8 → 3; tempo 1200 s → 840 s (a multiple of 5); reps and loads stay.
    const scaled = scaleVolume(gym, 0.7)
    expect(scaled.map(step => baseValue(step, step.type === 'sets' ? 'sets' : 'seconds'))).toEqual([2, 3, 840])
    expect(baseValue(scaled[0]!, 'reps')).toBe(8)
    expect(baseValue(scaled[0]!, 'loadKg')).toBe(40)
    expect(baseValue(scaled[1]!, 'percent1rm')).toBe(70)
  })

  it('adds up tonnage in key numbers', () => {
    // Squat 3 × 8 × 40 kg = 960 kg; the %1RM lift adds nothing (no kg known without the athlete).
    expect(keyNumbers(gym)).toMatchObject({ sets: 7, reps: 44, loadKg: 40, percent1rm: 70, tonnageKg: 960 })
  })
})

describe('ruleProblem: what validation refuses', () => {
  it('refuses rounds past 100 over the block', () => {
    // 6 rounds + 5 a week for 26 weeks = 6 + 125 = 131 > 100.
    expect(ruleProblem(hills, { stepId: 'reps', field: 'rounds', by: 5 }, 26)).toMatch(/131.*100/)
    expect(ruleProblem(hills, { stepId: 'reps', field: 'rounds', by: 5, cap: 20 }, 26)).toBeNull()
  })

  it('refuses %1RM caps above 100 and fields the step lacks', () => {
    expect(ruleProblem(gym, { stepId: 'deadlift', field: 'percent1rm', by: 1, cap: 105 }, 8)).toMatch(/between 1 and 100/)
    expect(ruleProblem(gym, { stepId: 'deadlift', field: 'loadKg', by: 1 }, 8)).toMatch(/no load/)
    expect(ruleProblem(gym, { stepId: 'nowhere', field: 'sets', by: 1 }, 8)).toMatch(/not in the routine/)
  })

  it('refuses loads past the 500 kg maximum', () => {
    // 40 kg + 20 kg a week for 26 weeks = 40 + 500 = 540 > 500.
    expect(ruleProblem(gym, { stepId: 'squat', field: 'loadKg', by: 20 }, 26)).toMatch(/540.*500/)
  })
})
