import { MAX_REPEAT, MAX_STEP_SECONDS, type BlockStep, type RoutineStep, type SetsStep } from '../schemas/routine-steps'
import { buildTimeline } from './timeline'
import { defineVocabulary } from './vocabulary'

// Week-by-week changes to a routine across a training block. Pure: the planner, the preview and the
// tests all call these. Progressions (add a round a week, add load in plate steps), lighter weeks and
// a taper are common coaching practice; no published source is claimed for any of their numbers.

export const progressionFields = defineVocabulary({
  rounds: 'Rounds', reps: 'Reps per set', sets: 'Sets', seconds: 'Seconds of work',
  meters: 'Metres of work', loadKg: 'Load (kg)', percent1rm: '% of 1RM', rpe: 'Target effort (RPE)',
})
export type ProgressionField = typeof progressionFields.values[number]

/** The most each field may ever reach: the step tree's own limits, with %1RM held to 100. */
export const progressionLimits: Record<ProgressionField, { min: number, max: number }> = {
  rounds: { min: 1, max: MAX_REPEAT },
  reps: { min: 1, max: 1000 },
  sets: { min: 1, max: 50 },
  seconds: { min: 1, max: MAX_STEP_SECONDS },
  meters: { min: 1, max: 100_000 },
  loadKg: { min: 0.5, max: 500 },
  percent1rm: { min: 1, max: 100 },
  rpe: { min: 0, max: 10 },
}

export const DEFAULT_PLATE_KG = 2.5

export interface ProgressionRule {
  stepId: string
  field: ProgressionField
  /** Change per step of progression: rounds, reps, sets, seconds, metres, kg, percentage points or RPE; a percent of the load when `mode` is 'percent'. */
  by: number
  /** 'percent' grows a kg load by `by` % per step (compounded); only for loadKg. */
  mode?: 'add' | 'percent'
  /** Weeks per step of progression (1 = every week). */
  every?: number
  /** The value never passes this (a ceiling when rising, a floor when falling). */
  cap?: number
}

export interface LighterWeeks {
  /** Every k-th week is lighter (week k, 2k, …). */
  every?: number
  /** Chosen weeks, 1-based. */
  weeks?: number[]
  /** Volume multiplier, e.g. 0.7. */
  factor: number
}

export interface Taper {
  /** How many weeks, counting back from the race week (or the last week). */
  weeks: number
  factor: number
}

export const weekKinds = defineVocabulary({ regular: 'regular week', lighter: 'lighter week', taper: 'taper week' })
export type WeekKind = typeof weekKinds.values[number]

export interface BlockShape {
  weeks: number
  lighter?: LighterWeeks | null
  taper?: Taper | null
  /** The week the goal race falls in, when it falls inside the block; the taper ends there. */
  raceWeek?: number | null
}

export interface FieldOverride {
  stepId: string
  field: ProgressionField
  value: number
}

/** Which week of the block a day falls in (1-based), or null outside the block. */
export function weekOfBlock(startDate: string, weeks: number, day: string): number | null {
  const days = Math.round((Date.parse(`${day}T00:00:00Z`) - Date.parse(`${startDate}T00:00:00Z`)) / 86_400_000)
  if (days < 0) return null
  const week = Math.floor(days / 7) + 1
  return week <= weeks ? week : null
}

/** Taper weeks end with the race week when the race falls inside the block, else with the last week. */
export function taperWeeks(shape: BlockShape): number[] {
  if (!shape.taper || shape.taper.weeks <= 0) return []
  const last = shape.raceWeek && shape.raceWeek <= shape.weeks ? shape.raceWeek : shape.weeks
  const first = Math.max(1, last - shape.taper.weeks + 1)
  return Array.from({ length: last - first + 1 }, (_, index) => first + index)
}

/** A taper week wins over a lighter week; a lighter week never scales twice. */
export function weekKind(week: number, shape: BlockShape): WeekKind {
  if (taperWeeks(shape).includes(week)) return 'taper'
  const lighter = shape.lighter
  if (lighter) {
    if (lighter.weeks?.includes(week)) return 'lighter'
    if (lighter.every && lighter.every >= 2 && week % lighter.every === 0) return 'lighter'
  }
  return 'regular'
}

export function volumeFactor(week: number, shape: BlockShape): number {
  const kind = weekKind(week, shape)
  if (kind === 'taper') return shape.taper!.factor
  if (kind === 'lighter') return shape.lighter!.factor
  return 1
}

/** Rounds a load to the nearest plate step (the smallest total change the team's plates allow). */
export function roundToPlates(kg: number, plateKg = DEFAULT_PLATE_KG): number {
  if (!(plateKg > 0)) return kg
  const rounded = Math.round(kg / plateKg) * plateKg
  return Number(Math.max(plateKg, rounded).toFixed(4))
}

/** A field's value in a step, or undefined when the step has no such number. */
export function baseValue(step: RoutineStep, field: ProgressionField): number | undefined {
  if (step.type === 'repeat') return field === 'rounds' ? step.times : undefined
  const measure = step.type === 'sets' ? step.perSet : step.measure
  switch (field) {
    case 'rounds': return undefined
    case 'sets': return step.type === 'sets' ? step.sets : undefined
    case 'reps': return measure.by === 'reps' ? measure.reps : undefined
    case 'seconds': return measure.by === 'time' ? measure.seconds : undefined
    case 'meters': return measure.by === 'distance' ? measure.meters : undefined
    case 'loadKg': return step.target?.type === 'load' ? step.target.kg : undefined
    case 'percent1rm': return step.target?.type === 'percent1rm' ? step.target.percent : undefined
    case 'rpe': return step.target?.type === 'effort' ? step.target.rpe : undefined
  }
}

function tidy(field: ProgressionField, value: number, plateKg: number): number {
  const { min, max } = progressionLimits[field]
  let result: number
  if (field === 'loadKg') result = roundToPlates(value, plateKg)
  else if (field === 'percent1rm') result = Math.round(value * 2) / 2
  else if (field === 'rpe') result = Math.round(value * 2) / 2
  else result = Math.round(value)
  return Math.min(max, Math.max(min, result))
}

/**
 * The value a rule gives in a week, before any lighter-week or taper scaling.
 * Week 1 is the routine as written; each `every` weeks adds one step of `by`, stopped at `cap`.
 */
export function progressedValue(base: number, rule: ProgressionRule, week: number, plateKg = DEFAULT_PLATE_KG): number {
  const steps = Math.floor((week - 1) / Math.max(1, rule.every ?? 1))
  let value = rule.mode === 'percent' ? base * (1 + rule.by / 100) ** steps : base + rule.by * steps
  if (rule.cap !== undefined) value = rule.by >= 0 ? Math.min(value, rule.cap) : Math.max(value, rule.cap)
  return tidy(rule.field, value, plateKg)
}

/** The highest (or, for a falling rule, lowest) raw value a rule reaches over `weeks`, for validation. */
export function furthestValue(base: number, rule: ProgressionRule, weeks: number): number {
  const steps = Math.floor((weeks - 1) / Math.max(1, rule.every ?? 1))
  let value = rule.mode === 'percent' ? base * (1 + rule.by / 100) ** steps : base + rule.by * steps
  if (rule.cap !== undefined) value = rule.by >= 0 ? Math.min(value, rule.cap) : Math.max(value, rule.cap)
  return value
}

function findStep(steps: readonly RoutineStep[], id: string): RoutineStep | undefined {
  for (const step of steps) {
    if (step.id === id) return step
    if (step.type === 'repeat') {
      const inner = findStep(step.steps, id)
      if (inner) return inner
    }
  }
  return undefined
}

export { findStep as findStepById }

function setField(step: RoutineStep, field: ProgressionField, value: number): RoutineStep {
  if (step.type === 'repeat') return field === 'rounds' ? { ...step, times: value } : step
  if (field === 'sets' && step.type === 'sets') return { ...step, sets: value }
  const withMeasure = (measure: BlockStep['measure']): RoutineStep => step.type === 'sets' ? { ...step, perSet: measure } : { ...step, measure }
  const measure = step.type === 'sets' ? step.perSet : step.measure
  if (field === 'reps' && measure.by === 'reps') return withMeasure({ by: 'reps', reps: value })
  if (field === 'seconds' && measure.by === 'time') return withMeasure({ by: 'time', seconds: value })
  if (field === 'meters' && measure.by === 'distance') return withMeasure({ by: 'distance', meters: value })
  if (field === 'loadKg' && step.target?.type === 'load') return { ...step, target: { type: 'load', kg: value } } as RoutineStep
  if (field === 'percent1rm' && step.target?.type === 'percent1rm') return { ...step, target: { type: 'percent1rm', percent: value } } as RoutineStep
  if (field === 'rpe' && step.target?.type === 'effort') return { ...step, target: { type: 'effort', rpe: value } } as RoutineStep
  return step
}

function mapSteps(steps: readonly RoutineStep[], visit: (step: RoutineStep, depth: number) => RoutineStep, depth = 0): RoutineStep[] {
  return steps.map((step) => {
    const changed = visit(step, depth)
    return changed.type === 'repeat' ? { ...changed, steps: mapSteps(changed.steps, visit, depth + 1) } : changed
  })
}

/**
 * Volume down, intensity kept: outermost repeats' rounds, every set count, and the time or distance
 * of work blocks outside repeats are multiplied by `factor` (never below 1); reps, loads and efforts stay.
 */
export function scaleVolume(steps: readonly RoutineStep[], factor: number): RoutineStep[] {
  if (factor === 1) return steps.map(step => structuredClone(step))
  return mapSteps(steps, (step, depth) => {
    if (step.type === 'repeat') return depth === 0 ? { ...step, times: Math.max(1, Math.round(step.times * factor)) } : step
    if (step.type === 'sets') return { ...step, sets: Math.max(1, Math.round(step.sets * factor)) } satisfies SetsStep
    if (depth === 0 && step.kind === 'work') {
      if (step.measure.by === 'time') return { ...step, measure: { by: 'time', seconds: Math.max(5, Math.round(step.measure.seconds * factor / 5) * 5) } }
      if (step.measure.by === 'distance') return { ...step, measure: { by: 'distance', meters: Math.max(10, Math.round(step.measure.meters * factor / 10) * 10) } }
    }
    return step
  })
}

export interface WeekPlanOptions {
  rules: readonly ProgressionRule[]
  shape: BlockShape
  plateKg?: number
  /** Numbers the coach set by hand for this week; they win over rules and scaling. */
  overrides?: readonly FieldOverride[]
}

export interface PlannedWeek {
  week: number
  kind: WeekKind
  factor: number
  overridden: boolean
  steps: RoutineStep[]
}

/** One week of a routine in a block: rules, then the week's volume factor, then the coach's own numbers. */
export function planWeek(steps: readonly RoutineStep[], week: number, options: WeekPlanOptions): PlannedWeek {
  const plateKg = options.plateKg ?? DEFAULT_PLATE_KG
  const progressed = mapSteps(steps, (step) => {
    let next = step
    for (const rule of options.rules) {
      if (rule.stepId !== step.id) continue
      const base = baseValue(step, rule.field)
      if (base === undefined) continue
      next = setField(next, rule.field, progressedValue(base, rule, week, plateKg))
    }
    return next
  })
  const kind = weekKind(week, options.shape)
  const factor = volumeFactor(week, options.shape)
  let result = scaleVolume(progressed, factor)
  const overrides = options.overrides ?? []
  if (overrides.length) {
    result = mapSteps(result, (step) => {
      let next = step
      for (const override of overrides) {
        if (override.stepId === step.id && baseValue(step, override.field) !== undefined) {
          next = setField(next, override.field, tidy(override.field, override.value, plateKg))
        }
      }
      return next
    })
  }
  return { week, kind, factor, overridden: overrides.length > 0, steps: result }
}

/** Every block (non-repeat) step's and repeat's numbers, keyed "stepId:field", in tree order. */
export function numbersOf(steps: readonly RoutineStep[]): Map<string, number> {
  const numbers = new Map<string, number>()
  const visit = (list: readonly RoutineStep[]) => {
    for (const step of list) {
      for (const field of progressionFields.values) {
        const value = baseValue(step, field)
        if (value !== undefined) numbers.set(`${step.id}:${field}`, value)
      }
      if (step.type === 'repeat') visit(step.steps)
    }
  }
  visit(steps)
  return numbers
}

const changeUnits: Record<ProgressionField, (delta: number) => string> = {
  rounds: d => `${Math.abs(d)} round${Math.abs(d) === 1 ? '' : 's'}`,
  reps: d => `${Math.abs(d)} rep${Math.abs(d) === 1 ? '' : 's'} per set`,
  sets: d => `${Math.abs(d)} set${Math.abs(d) === 1 ? '' : 's'}`,
  seconds: d => `${Math.abs(d)} s`,
  meters: d => `${Math.abs(d)} m`,
  loadKg: d => `${Number(Math.abs(d).toFixed(2))} kg`,
  percent1rm: d => `${Number(Math.abs(d).toFixed(1))} % of 1RM`,
  rpe: d => `${Number(Math.abs(d).toFixed(1))} RPE`,
}

/** What changed from last week in plain words: ["+1 round", "−2.5 kg"]. Same step ids in both trees. */
export function describeChanges(previous: readonly RoutineStep[], current: readonly RoutineStep[]): string[] {
  const before = numbersOf(previous)
  const changes: string[] = []
  for (const [key, value] of numbersOf(current)) {
    const old = before.get(key)
    if (old === undefined || old === value) continue
    const field = key.slice(key.lastIndexOf(':') + 1) as ProgressionField
    const delta = value - old
    changes.push(`${delta > 0 ? '+' : '−'}${changeUnits[field](delta)}`)
  }
  return changes
}

export interface KeyNumbers {
  /** Rounds of the outermost repeats, added up. */
  rounds: number
  /** Reps across every set and round. */
  reps: number
  sets: number
  /** The heaviest kg load and the highest %1RM in the routine, when it has them. */
  loadKg: number | null
  percent1rm: number | null
  durationS: number
  workS: number
  /** Planned kg × reps of loaded sets: the lifting volume. */
  tonnageKg: number
}

export function keyNumbers(steps: readonly RoutineStep[]): KeyNumbers {
  const { segments, totals } = buildTimeline(steps)
  let loadKg: number | null = null
  let percent1rm: number | null = null
  let tonnageKg = 0
  for (const segment of segments) {
    if (segment.kind !== 'work') continue
    if (segment.target?.type === 'load') {
      loadKg = Math.max(loadKg ?? 0, segment.target.kg)
      if (segment.measure.by === 'reps') tonnageKg += segment.target.kg * segment.measure.reps
    }
    if (segment.target?.type === 'percent1rm') percent1rm = Math.max(percent1rm ?? 0, segment.target.percent)
  }
  const rounds = steps.reduce((sum, step) => sum + (step.type === 'repeat' ? step.times : 0), 0)
  return { rounds, reps: totals.reps, sets: totals.sets, loadKg, percent1rm, durationS: Math.round(totals.durationS), workS: Math.round(totals.workS), tonnageKg }
}

/** Why a rule cannot apply to a routine over a block, or null when it can. */
export function ruleProblem(steps: readonly RoutineStep[], rule: ProgressionRule, weeks: number): string | null {
  const step = findStep(steps, rule.stepId)
  if (!step) return 'This step is not in the routine'
  const base = baseValue(step, rule.field)
  if (base === undefined) return `This step has no ${progressionFields.labels[rule.field].toLowerCase()} to change`
  if (rule.mode === 'percent' && rule.field !== 'loadKg') return 'Only a kg load can grow by a percentage'
  const { min, max } = progressionLimits[rule.field]
  if (rule.cap !== undefined && (rule.cap > max || rule.cap < min)) return `The cap must be between ${min} and ${max}`
  const furthest = furthestValue(base, rule, weeks)
  if (furthest > max) return `By week ${weeks} this reaches ${Number(furthest.toFixed(1))}; the most allowed is ${max}. Set a cap or a smaller step`
  if (furthest < min) return `By week ${weeks} this falls to ${Number(furthest.toFixed(1))}; the least allowed is ${min}. Set a floor or a smaller step`
  return null
}

export interface ProgressableStep {
  stepId: string
  /** Depth in the tree, for indenting a picker. */
  depth: number
  step: RoutineStep
  fields: ProgressionField[]
}

/** The steps of a routine that have at least one number a rule can change, in tree order. */
export function progressableSteps(steps: readonly RoutineStep[]): ProgressableStep[] {
  const found: ProgressableStep[] = []
  const visit = (list: readonly RoutineStep[], depth: number) => {
    for (const step of list) {
      const fields = progressionFields.values.filter(field => baseValue(step, field) !== undefined)
      if (fields.length) found.push({ stepId: step.id, depth, step, fields })
      if (step.type === 'repeat') visit(step.steps, depth + 1)
    }
  }
  visit(steps, 0)
  return found
}
