import { z } from 'zod'
import { checkNumber } from './numbers'
import { formatDuration, hillPaceForEffort } from './pace'
import type { TrainingPaces } from './pace'
import { blockKindLabels, blockKinds, type BlockKind } from './vocabulary'

// The routine step tree. One schema serves the builder's forms and the server's checks.

export const MAX_STEP_SECONDS = 6 * 3600
export const MAX_ROUTINE_SECONDS = 12 * 3600
export const MAX_REPEAT = 100
export const MAX_NESTING = 3
export const MAX_STEPS = 200
// A guard against repeats of repeats multiplying into a timeline no session could hold.
export const MAX_SEGMENTS = 10_000
// Assumed for distance steps whose pace is unknown: no target pace, or no benchmark race for the athlete.
export const DEFAULT_PACE_S_PER_KM = 360
export const DEFAULT_SECONDS_PER_REP = 3

export const paceZones = ['easy', 'marathon', 'threshold', 'tenK', 'fiveK', 'mile'] as const

export type PaceZone = typeof paceZones[number]

export const measureSchema = z.discriminatedUnion('by', [
  z.object({ by: z.literal('time'), seconds: z.number().positive('Time must be more than 0 seconds').max(MAX_STEP_SECONDS, 'A step can last at most 6 hours') }),
  z.object({ by: z.literal('distance'), meters: z.number().positive('Distance must be more than 0 m').max(100_000, 'A step can cover at most 100 km') }),
  z.object({ by: z.literal('reps'), reps: z.number().int('Reps must be a whole number').positive('Reps must be at least 1').max(1000, 'At most 1,000 reps in a step') }),
])

export const targetSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('pace'), zone: z.enum(paceZones) }),
  z.object({ type: z.literal('effort'), rpe: z.number().min(0, 'RPE runs from 0 to 10').max(10, 'RPE runs from 0 to 10') }),
  z.object({ type: z.literal('load'), kg: z.number().positive('Load must be more than 0 kg').max(500, 'Load must be at most 500 kg') }),
  // %1RM stops at 100: a target above the athlete's one-rep max is not a set anyone should be given.
  z.object({ type: z.literal('percent1rm'), percent: z.number().positive('Percent must be more than 0').max(100, 'Percent of 1RM is at most 100') }),
])

export type Measure = z.infer<typeof measureSchema>
export type Target = z.infer<typeof targetSchema>

const stepId = z.string().min(1, 'Every step needs an id').max(64, 'Step ids are at most 64 characters')
const note = z.string().max(500, 'Notes are at most 500 characters')
const exerciseId = z.number().int().positive('Pick an exercise')

export const blockStepSchema = z.object({
  id: stepId,
  type: z.literal('block'),
  kind: z.enum(blockKinds),
  measure: measureSchema,
  exerciseId: exerciseId.optional(),
  target: targetSchema.optional(),
  grade: z.number().min(-0.45, 'Grade must be between -45 % and +45 %').max(0.45, 'Grade must be between -45 % and +45 %').optional(),
  note: note.optional(),
})

export const setsStepSchema = z.object({
  id: stepId,
  type: z.literal('sets'),
  exerciseId,
  sets: z.number().int('Sets must be a whole number').positive('At least 1 set').max(50, 'At most 50 sets'),
  perSet: measureSchema,
  restSeconds: z.number().min(0, 'Rest cannot be negative').max(3600, 'Rest between sets is at most 1 hour'),
  target: targetSchema.optional(),
  note: note.optional(),
})

export type BlockStep = z.infer<typeof blockStepSchema>
export type SetsStep = z.infer<typeof setsStepSchema>
export interface RepeatStep {
  id: string
  type: 'repeat'
  times: number
  skipLastRecovery?: boolean
  steps: RoutineStep[]
}
export type RoutineStep = BlockStep | SetsStep | RepeatStep

export const repeatStepSchema: z.ZodType<RepeatStep> = z.object({
  id: stepId,
  type: z.literal('repeat'),
  times: z.number().int('Repeats must be a whole number').positive('Repeat at least once').max(MAX_REPEAT, `Repeat at most ${MAX_REPEAT} times`),
  skipLastRecovery: z.boolean().optional(),
  get steps() {
    return z.array(routineStepSchema).min(1, 'A repeat needs at least one step inside')
  },
})

export const routineStepSchema: z.ZodType<RoutineStep> = z.union([blockStepSchema, setsStepSchema, repeatStepSchema])

export const routineStepsSchema = z.array(routineStepSchema).superRefine((steps, ctx) => {
  // Zod runs this even when a step failed its own checks; only time a routine whose steps all passed.
  const stepsAreValid = ctx.issues.length === 0
  const firstPathOfId = new Map<string, string>()
  let stepCount = 0
  const walk = (list: readonly RoutineStep[], parentPath: (string | number)[], depth: number) => {
    list.forEach((step, index) => {
      if (typeof step !== 'object' || step === null) {
        return
      }
      const path = [...parentPath, index]
      stepCount += 1
      if (stepCount === MAX_STEPS + 1) {
        ctx.addIssue({ code: 'custom', path, message: `A routine can have at most ${MAX_STEPS} steps, counting the steps inside repeats` })
      }
      const firstPath = firstPathOfId.get(step.id)
      if (firstPath !== undefined) {
        ctx.addIssue({ code: 'custom', path: [...path, 'id'], message: `Step id "${step.id}" is already used by step ${firstPath}` })
      }
      else if (typeof step.id === 'string') {
        firstPathOfId.set(step.id, path.join('.'))
      }
      if (step.type === 'repeat') {
        if (depth + 1 === MAX_NESTING + 1) {
          ctx.addIssue({ code: 'custom', path, message: `Repeats can be nested at most ${MAX_NESTING} deep` })
        }
        if (Array.isArray(step.steps)) {
          walk(step.steps, [...path, 'steps'], depth + 1)
        }
      }
    })
  }
  walk(steps, [], 0)
  if (!stepsAreValid) {
    return
  }

  let segmentCount = 0
  for (const [index, step] of steps.entries()) {
    segmentCount += segmentCountOf(step)
    if (segmentCount > MAX_SEGMENTS) {
      ctx.addIssue({ code: 'custom', path: [index], message: `This routine expands to more than ${MAX_SEGMENTS.toLocaleString('en')} intervals; use fewer repeats` })
      return
    }
  }
  const { segments, totals } = buildTimeline(steps)
  if (totals.durationS > MAX_ROUTINE_SECONDS) {
    const crossing = segments.find(segment => segment.startS + segment.durationS > MAX_ROUTINE_SECONDS)!
    ctx.addIssue({
      code: 'custom',
      path: crossing.path.slice(0, 1),
      message: `A routine can last at most ${MAX_ROUTINE_SECONDS / 3600} hours; this one takes about ${formatDuration(totals.durationS)}`,
    })
  }
})

export interface RepeatRound {
  repeatId: string
  round: number
  of: number
}

export interface TimelineSegment {
  stepId: string
  /** Where the step sits in the tree, as a zod issue path would name it: [2, 'steps', 0]. */
  path: (string | number)[]
  /** The block's kind; 'work' for a set and 'rest' for the rest between sets. */
  kind: BlockKind
  label: string
  startS: number
  durationS: number
  /** The duration is a guess: reps, or a distance without the athlete's pace for it. */
  estimated: boolean
  measure: Measure
  exerciseId?: number
  target?: Target
  /** s/km, grade-adjusted on a hill; only when the athlete's paces and the step's pace target are known. */
  targetPace?: number
  grade?: number
  note?: string
  set?: number
  setOf?: number
  /** The innermost repeat's round, from 1. */
  round?: number
  roundOf?: number
  /** Every enclosing repeat's round, outermost first. */
  rounds?: RepeatRound[]
}

export interface TimelineTotals {
  durationS: number
  workS: number
  /** Metres of distance-measured steps only; timed steps add no distance even at a known pace. */
  distanceM: number
  sets: number
  reps: number
  estimated: boolean
}

export interface Timeline {
  segments: TimelineSegment[]
  totals: TimelineTotals
}

export interface TimelineOptions {
  paces?: TrainingPaces
  secondsPerRep?: number
}

type DraftSegment = Omit<TimelineSegment, 'startS'>

/** Flattens a step tree into timed segments in the order an athlete does them, with totals. */
export function buildTimeline(steps: readonly RoutineStep[], options: TimelineOptions = {}): Timeline {
  if (!Array.isArray(steps)) {
    throw new TypeError('A routine\'s steps must be a list')
  }
  const secondsPerRep = checkNumber('Seconds per rep', options.secondsPerRep ?? DEFAULT_SECONDS_PER_REP, 0, 600, { exclusiveMin: true })
  const segmentCount = steps.reduce((count, step) => count + segmentCountOf(step), 0)
  if (segmentCount > MAX_SEGMENTS) {
    throw new RangeError(`This routine expands to ${segmentCount} intervals; at most ${MAX_SEGMENTS} are allowed`)
  }
  const drafts = expandSteps(steps, [], [], { paces: options.paces, secondsPerRep })

  let clock = 0
  const segments = drafts.map((draft) => {
    const segment: TimelineSegment = { ...draft, startS: clock }
    clock += draft.durationS
    return segment
  })
  const totals: TimelineTotals = { durationS: clock, workS: 0, distanceM: 0, sets: 0, reps: 0, estimated: false }
  for (const segment of segments) {
    if (segment.kind === 'work') {
      totals.workS += segment.durationS
    }
    if (segment.kind === 'work' && segment.setOf !== undefined) {
      totals.sets += 1
    }
    if (segment.measure.by === 'distance') {
      totals.distanceM += segment.measure.meters
    }
    if (segment.measure.by === 'reps') {
      totals.reps += segment.measure.reps
    }
    totals.estimated ||= segment.estimated
  }
  return { segments, totals }
}

interface ExpandContext {
  paces?: TrainingPaces
  secondsPerRep: number
}

function expandSteps(steps: readonly RoutineStep[], parentPath: (string | number)[], rounds: RepeatRound[], context: ExpandContext): DraftSegment[] {
  const innermost = rounds.at(-1)
  const roundFields = innermost ? { round: innermost.round, roundOf: innermost.of, rounds } : {}
  return steps.flatMap((step, index): DraftSegment[] => {
    const path = [...parentPath, index]
    if (step.type === 'block') {
      return [{
        stepId: step.id,
        path,
        kind: step.kind,
        label: blockKindLabels[step.kind],
        measure: step.measure,
        ...timing(step.measure, step.target, step.grade, context),
        ...optional({ exerciseId: step.exerciseId, target: step.target, grade: step.grade, note: step.note }),
        ...roundFields,
      }]
    }
    if (step.type === 'sets') {
      const segments: DraftSegment[] = []
      for (let set = 1; set <= step.sets; set++) {
        segments.push({
          stepId: step.id,
          path,
          kind: 'work',
          label: `Set ${set} of ${step.sets}`,
          measure: step.perSet,
          ...timing(step.perSet, step.target, undefined, context),
          exerciseId: step.exerciseId,
          ...optional({ target: step.target, note: step.note }),
          set,
          setOf: step.sets,
          ...roundFields,
        })
        if (set < step.sets && step.restSeconds > 0) {
          segments.push({
            stepId: step.id,
            path,
            kind: 'rest',
            label: 'Rest',
            measure: { by: 'time', seconds: step.restSeconds },
            durationS: step.restSeconds,
            estimated: false,
            set,
            setOf: step.sets,
            ...roundFields,
          })
        }
      }
      return segments
    }
    const segments: DraftSegment[] = []
    for (let round = 1; round <= step.times; round++) {
      const roundSegments = expandSteps(step.steps, [...path, 'steps'], [...rounds, { repeatId: step.id, round, of: step.times }], context)
      if (round === step.times && step.skipLastRecovery) {
        while (roundSegments.length > 0 && isRecovery(roundSegments.at(-1)!)) {
          roundSegments.pop()
        }
      }
      segments.push(...roundSegments)
    }
    return segments
  })
}

function isRecovery(segment: DraftSegment): boolean {
  return segment.kind === 'recovery' || segment.kind === 'rest'
}

function timing(measure: Measure, target: Target | undefined, grade: number | undefined, context: ExpandContext) {
  const targetPace = knownPace(target, grade, context.paces)
  const paceFields = targetPace === undefined ? {} : { targetPace }
  if (measure.by === 'time') {
    return { durationS: measure.seconds, estimated: false, ...paceFields }
  }
  if (measure.by === 'reps') {
    return { durationS: measure.reps * context.secondsPerRep, estimated: true, ...paceFields }
  }
  const pace = targetPace ?? gradeAdjusted(DEFAULT_PACE_S_PER_KM, grade)
  return { durationS: measure.meters / 1000 * pace, estimated: targetPace === undefined, ...paceFields }
}

/** The athlete's pace for a pace target; easy runs at the midpoint of its range. */
function knownPace(target: Target | undefined, grade: number | undefined, paces: TrainingPaces | undefined): number | undefined {
  if (target?.type !== 'pace' || !paces) {
    return undefined
  }
  const zonePace = target.zone === 'easy' ? (paces.easy.fast + paces.easy.slow) / 2 : paces[target.zone]
  checkNumber(`Training pace for ${target.zone} (s/km)`, zonePace, 0, 6 * 3600, { exclusiveMin: true })
  return gradeAdjusted(zonePace, grade)
}

function gradeAdjusted(flatPace: number, grade: number | undefined): number {
  return grade ? hillPaceForEffort(flatPace, grade) : flatPace
}

function segmentCountOf(step: RoutineStep): number {
  if (step.type === 'block') {
    return 1
  }
  if (step.type === 'sets') {
    return step.restSeconds > 0 ? 2 * step.sets - 1 : step.sets
  }
  return step.times * step.steps.reduce((count, inner) => count + segmentCountOf(inner), 0)
}

/** Drops undefined fields so segments carry only what the step sets. */
function optional<T extends Record<string, unknown>>(fields: T): Partial<T> {
  return Object.fromEntries(Object.entries(fields).filter(([, value]) => value !== undefined)) as Partial<T>
}
