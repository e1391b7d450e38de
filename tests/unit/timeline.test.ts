import { describe, expect, it } from 'vitest'
import { fieldErrors } from '../../shared/utils/errors'
import { trainingPaces } from '../../shared/utils/pace'
import { MAX_SEGMENTS, routineStepsSchema } from '../../shared/schemas/routine-steps'
import { DEFAULT_PACE_S_PER_KM, buildTimeline } from '../../shared/utils/timeline'
import type { BlockStep, Measure, RoutineStep, SetsStep, Target } from '../../shared/schemas/routine-steps'

let nextId = 0
const block = (kind: BlockStep['kind'], measure: Measure, extra: Partial<BlockStep> = {}): BlockStep =>
  ({ id: `b${nextId++}`, type: 'block', kind, measure, ...extra })
const seconds = (value: number): Measure => ({ by: 'time', seconds: value })
const meters = (value: number): Measure => ({ by: 'distance', meters: value })
const reps = (value: number): Measure => ({ by: 'reps', reps: value })
const pace = (zone: Extract<Target, { type: 'pace' }>['zone']): Target => ({ type: 'pace', zone })
const repeat = (times: number, steps: RoutineStep[], skipLastRecovery = false): RoutineStep =>
  ({ id: `r${nextId++}`, type: 'repeat', times, skipLastRecovery, steps })
const sets = (count: number, perSet: Measure, restSeconds: number): SetsStep =>
  ({ id: `s${nextId++}`, type: 'sets', exerciseId: 7, sets: count, perSet, restSeconds })

const hillReps = () => [repeat(8, [
  block('work', seconds(60), { grade: 0.08, target: { type: 'effort', rpe: 8 }, exerciseId: 3 }),
  block('recovery', seconds(90), { note: 'Jog back down' }),
])]

describe('buildTimeline', () => {
  it('8 × [60 s hard uphill, 90 s jog back] is 1,200 s with 480 s of work (common practice, no published source)', () => {
    const { segments, totals } = buildTimeline(hillReps())
    expect(totals.durationS).toBe(1200)
    expect(totals.workS).toBe(480)
    expect(totals.estimated).toBe(false)
    expect(segments).toHaveLength(16)
    expect(segments.map(segment => segment.round)).toEqual([1, 1, 2, 2, 3, 3, 4, 4, 5, 5, 6, 6, 7, 7, 8, 8])
    expect(segments[2]).toMatchObject({ kind: 'work', startS: 150, durationS: 60, grade: 0.08, exerciseId: 3, roundOf: 8, path: [0, 'steps', 0] })
    expect(segments[15]).toMatchObject({ kind: 'recovery', startS: 1110, note: 'Jog back down' })
  })

  it('6 × 3 min at 5K pace with 2 min jogs, last jog dropped, is 1,080 + 600 = 1,680 s (common practice, no published source)', () => {
    const steps = [repeat(6, [block('work', seconds(180), { target: pace('fiveK') }), block('recovery', seconds(120))], true)]
    const { segments, totals } = buildTimeline(steps)
    expect(totals.durationS).toBe(1680)
    expect(totals.workS).toBe(1080)
    expect(segments).toHaveLength(11)
    expect(segments.at(-1)).toMatchObject({ kind: 'work', round: 6, startS: 1500 })
  })

  it('3 sets × 8 reps with 90 s rest at 3 s a rep is 252 s, marked estimated (common practice, no published source)', () => {
    const { segments, totals } = buildTimeline([sets(3, reps(8), 90)])
    expect(totals).toEqual({ durationS: 252, workS: 72, distanceM: 0, sets: 3, reps: 24, estimated: true })
    expect(segments.map(segment => segment.kind)).toEqual(['work', 'rest', 'work', 'rest', 'work'])
    expect(segments.map(segment => segment.set)).toEqual([1, 1, 2, 2, 3])
    expect(segments[1]).toMatchObject({ estimated: false, durationS: 90, measure: { by: 'time', seconds: 90 } })
    expect(buildTimeline([sets(3, reps(8), 90)], { secondsPerRep: 5 }).totals.durationS).toBe(300)
  })

  it('gives no rest segment for a rest of 0 and none after the last set', () => {
    const { segments, totals } = buildTimeline([sets(4, seconds(30), 0)])
    expect(segments.map(segment => segment.kind)).toEqual(['work', 'work', 'work', 'work'])
    expect(totals.durationS).toBe(120)
  })

  it('lays segments end to end from 0', () => {
    const { segments, totals } = buildTimeline([block('warmup', seconds(600)), ...hillReps(), sets(2, reps(10), 60), block('cooldown', meters(2000))])
    expect(segments[0]!.startS).toBe(0)
    for (let i = 1; i < segments.length; i++) {
      expect(segments[i]!.startS).toBeCloseTo(segments[i - 1]!.startS + segments[i - 1]!.durationS, 9)
    }
    expect(totals.durationS).toBeCloseTo(segments.at(-1)!.startS + segments.at(-1)!.durationS, 9)
  })

  describe('distance steps', () => {
    const tenKPaces = trainingPaces({ distanceM: 10_000, timeS: 2400 })
    const fiveKPaces = trainingPaces({ distanceM: 5000, timeS: 1200 })

    it('take 1 km at 10K pace from a 40:00 10K as 240 s', () => {
      const [segment] = buildTimeline([block('work', meters(1000), { target: pace('tenK') })], { paces: tenKPaces }).segments
      expect(segment).toMatchObject({ durationS: 240, targetPace: 240, estimated: false })
    })

    it('run easy at the midpoint of the easy range', () => {
      const [segment] = buildTimeline([block('work', meters(2000), { target: pace('easy') })], { paces: tenKPaces }).segments
      expect(segment!.durationS).toBeCloseTo(tenKPaces.easy.fast + tenKPaces.easy.slow, 9)
    })

    it('grade-adjust the pace on a hill — Minetti et al. (2002), "Energy cost of walking and running at extreme uphill and downhill slopes"', () => {
      // 5K pace 240 s/km × C(0.1)/C(0) = 240 × 5.968214/3.6 = 397.88 s/km, worked by hand.
      const [segment] = buildTimeline([block('work', meters(200), { target: pace('fiveK'), grade: 0.1 })], { paces: fiveKPaces }).segments
      expect(segment!.targetPace).toBeCloseTo(397.88093, 4)
      expect(segment!.durationS).toBeCloseTo(79.576187, 4)
    })

    it('assume 6:00 /km, marked estimated, without a known pace', () => {
      expect(DEFAULT_PACE_S_PER_KM).toBe(360)
      const untargeted = buildTimeline([block('work', meters(400))], { paces: tenKPaces }).segments[0]
      expect(untargeted).toMatchObject({ durationS: 144, estimated: true })
      expect(untargeted!.targetPace).toBeUndefined()
      const noPaces = buildTimeline([block('work', meters(1000), { target: pace('threshold') })]).segments[0]
      expect(noPaces).toMatchObject({ durationS: 360, estimated: true })
      expect(noPaces!.targetPace).toBeUndefined()
    })

    it('give a timed step its target pace without changing its duration', () => {
      const [segment] = buildTimeline([block('work', seconds(1200), { target: pace('threshold') })], { paces: tenKPaces }).segments
      expect(segment).toMatchObject({ durationS: 1200, targetPace: tenKPaces.threshold, estimated: false })
    })

    it('add up distance from distance-measured steps only', () => {
      const steps = [block('warmup', seconds(600)), repeat(6, [block('work', meters(400), { target: pace('mile') }), block('recovery', meters(400))])]
      expect(buildTimeline(steps, { paces: tenKPaces }).totals.distanceM).toBe(4800)
    })
  })

  describe('repeats', () => {
    it('nest, numbering each level and dropping the trailing recovery at each level that asks', () => {
      const inner = repeat(3, [block('work', seconds(30)), block('recovery', seconds(30))], true)
      const outer = repeat(2, [inner, block('rest', seconds(120))], true)
      const { segments, totals } = buildTimeline([outer])
      // Each round: 3 × 30 s work + 2 × 30 s jog = 150 s; the first round also keeps its 120 s rest.
      expect(totals.durationS).toBe(420)
      expect(segments.map(segment => segment.kind)).toEqual(['work', 'recovery', 'work', 'recovery', 'work', 'rest', 'work', 'recovery', 'work', 'recovery', 'work'])
      expect(segments.at(-1)!.rounds).toEqual([{ repeatId: outer.id, round: 2, of: 2 }, { repeatId: inner.id, round: 3, of: 3 }])
      expect(segments[5]).toMatchObject({ kind: 'rest', round: 1, roundOf: 2 })
    })

    it('drop every trailing recovery and rest of the final round', () => {
      const steps = [repeat(2, [block('work', seconds(60)), block('recovery', seconds(60)), block('rest', seconds(30))], true)]
      expect(buildTimeline(steps).totals.durationS).toBe(60 + 60 + 30 + 60)
    })
  })

  it('gives empty totals for no steps', () => {
    expect(buildTimeline([])).toEqual({ segments: [], totals: { durationS: 0, workS: 0, distanceM: 0, sets: 0, reps: 0, estimated: false } })
  })

  it('refuses a bad rep estimate and a routine that expands past the segment limit', () => {
    expect(() => buildTimeline([], { secondsPerRep: 0 })).toThrow(RangeError)
    expect(() => buildTimeline([], { secondsPerRep: Number.NaN })).toThrow(RangeError)
    const huge = [repeat(100, [repeat(100, [block('work', seconds(1)), block('rest', seconds(1))])])]
    expect(() => buildTimeline(huge)).toThrow(new RegExp(`at most ${MAX_SEGMENTS}`))
  })
})

describe('routineStepsSchema', () => {
  const issuesOf = (steps: unknown) => {
    const result = routineStepsSchema.safeParse(steps)
    expect(result.success).toBe(false)
    return result.error!.issues.map(issue => ({ path: issue.path, message: issue.message }))
  }

  it('accepts a routine of hills, sets and nested repeats', () => {
    const steps = [block('warmup', seconds(600)), ...hillReps(), repeat(2, [repeat(2, [repeat(2, [block('work', reps(10))])])]), sets(3, reps(8), 90)]
    expect(routineStepsSchema.safeParse(steps).success).toBe(true)
  })

  it('rejects a repeat of 101 times', () => {
    expect(issuesOf([repeat(101, [block('work', seconds(10))])])).toEqual([{ path: [0, 'times'], message: 'Repeat at most 100 times' }])
  })

  it('rejects repeats nested 4 deep, naming the fourth', () => {
    const steps = [repeat(2, [repeat(2, [repeat(2, [repeat(2, [block('work', seconds(10))])])])])]
    expect(issuesOf(steps)).toEqual([{ path: [0, 'steps', 0, 'steps', 0, 'steps', 0], message: 'Repeats can be nested at most 3 deep' }])
  })

  it('rejects a grade of 50 %', () => {
    const steps = [block('warmup', seconds(600)), repeat(4, [block('work', seconds(60), { grade: 0.5 })])]
    expect(issuesOf(steps)).toEqual([{ path: [1, 'steps', 0, 'grade'], message: 'Grade must be between -45 % and +45 %' }])
  })

  it('rejects negative reps in a block and in a set', () => {
    expect(issuesOf([block('work', seconds(5)), block('work', seconds(5)), repeat(2, [block('work', reps(-3))])]))
      .toEqual([{ path: [2, 'steps', 0, 'measure', 'reps'], message: 'Reps must be at least 1' }])
    expect(issuesOf([sets(3, reps(-8), 60)])).toEqual([{ path: [0, 'perSet', 'reps'], message: 'Reps must be at least 1' }])
  })

  it('rejects a zero-second step with a path a form can show', () => {
    const result = routineStepsSchema.safeParse([block('warmup', seconds(60)), block('warmup', seconds(60)), repeat(2, [block('work', seconds(0))])])
    expect(fieldErrors(result.error!)).toEqual({ '2.steps.0.measure.seconds': 'Time must be more than 0 seconds' })
  })

  it('rejects duplicate step ids, naming the second one', () => {
    const steps = [
      { ...block('work', seconds(60)), id: 'hill' },
      repeat(2, [{ ...block('recovery', seconds(60)), id: 'hill' }]),
    ]
    expect(issuesOf(steps)).toEqual([{ path: [1, 'steps', 0, 'id'], message: 'Step id "hill" is already used by step 0' }])
  })

  it('rejects a routine longer than 12 hours, naming the step that passes the limit', () => {
    const steps = [block('work', seconds(5 * 3600)), block('work', seconds(5 * 3600)), block('work', seconds(5 * 3600))]
    expect(issuesOf(steps)).toEqual([{ path: [2], message: 'A routine can last at most 12 hours; this one takes about 15:00:00' }])
  })

  it('counts estimated distance towards the 12 hours', () => {
    // 6 × 20 km at the assumed 6:00 /km is 12 h 0 min 0 s exactly, so it passes; one more metre does not.
    expect(routineStepsSchema.safeParse([repeat(6, [block('work', meters(20_000))])]).success).toBe(true)
    expect(issuesOf([repeat(6, [block('work', meters(20_001))])])[0]!.path).toEqual([0])
  })

  it('rejects more than 200 steps', () => {
    const steps = Array.from({ length: 201 }, () => block('work', seconds(1)))
    expect(issuesOf(steps)).toEqual([{ path: [200], message: 'A routine can have at most 200 steps, counting the steps inside repeats' }])
  })

  it('rejects repeats that multiply into too many intervals', () => {
    const steps = [repeat(100, [repeat(100, [block('work', seconds(1)), block('rest', seconds(1))])])]
    expect(issuesOf(steps)).toEqual([{ path: [0], message: 'This routine expands to more than 10,000 intervals; use fewer repeats' }])
  })

  it('reports a step\'s own errors and duplicate ids together', () => {
    const steps = [{ ...block('work', seconds(-60)), id: 'x' }, { ...block('work', seconds(60)), id: 'x' }]
    expect(issuesOf(steps).map(issue => issue.path)).toEqual([[0, 'measure', 'seconds'], [1, 'id']])
  })

  it('reports malformed steps by position without throwing', () => {
    const steps = [block('work', seconds(60)), { id: 'y', type: 'repeat', times: 2, steps: 'none' }, null]
    expect(issuesOf(steps).map(issue => issue.path)).toEqual([[1], [2]])
  })
})
