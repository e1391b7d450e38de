import { MAX_SEGMENTS, type Measure, type RoutineStep, type Target } from '../schemas/routine-steps'
import { checkNumber } from './numbers'
import { hillPaceForEffort } from './pace'
import type { TrainingPaces } from './pace'
import { blockKinds, type BlockKind } from './vocabulary'

// Assumed for distance steps whose pace is unknown: no target pace, or no benchmark race for the athlete.
export const DEFAULT_PACE_S_PER_KM = 360
export const DEFAULT_SECONDS_PER_REP = 3

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
        label: blockKinds.labels[step.kind],
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

export function segmentCountOf(step: RoutineStep): number {
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
