import type { AssignmentSnapshot, SnapshotExercise } from '../types/domain'
import { generalCautions, matchCautions, stepCautionsFor, type InjuryNoteLike, type MatchedCaution, type StepCautionKey } from './cautions'
import type { TrainingPaces } from './pace'
import { loadForPercent } from './strength'
import type { Target } from '../schemas/routine-steps'
import { buildTimeline, type TimelineSegment } from './timeline'
import type { BlockKind } from './vocabulary'

// What the player runs: the assignment's snapshot turned into one athlete's segments, with their
// paces and loads filled in and the cautions that concern them.

export interface PlanSegment {
  index: number
  /** Unique within the session: step, round and set (and the kind, for rests); entries are logged against it. */
  key: string
  stepId: string
  kind: BlockKind
  label: string
  exerciseId: number | null
  startS: number
  durationS: number
  /** The duration is an estimate (reps, or a distance without a known pace). */
  estimated: boolean
  /** Waits for "done" rather than ending on time: rep and distance steps. */
  manual: boolean
  measure: 'time' | 'distance' | 'reps'
  reps: number | null
  meters: number | null
  seconds: number | null
  set: number | null
  sets: number | null
  round: number | null
  rounds: number | null
  grade: number | null
  targetPaceSPerKm: number | null
  targetZone: string | null
  targetKg: number | null
  targetRpe: number | null
  percent1rm: number | null
  note: string | null
  /** Work the athlete logs (sets and work intervals); warm-ups, rests and recoveries are not logged. */
  loggable: boolean
  /** The exercise has cautions, or the step itself carries some (see stepCautions). */
  hasCautions: boolean
  /** Cautions that follow from the step itself: a climb, a descent, a sprint, a jump, a heavy lift. */
  stepCautions: StepCautionKey[]
}

export interface SessionPlan {
  title: string
  category: string
  description: string
  segments: PlanSegment[]
  totals: { durationS: number, workS: number, distanceM: number, sets: number, reps: number, estimated: boolean }
  equipment: string[]
  generalCautions: string[]
  /** Cautions concerning the athlete's active injury areas, shown first and prominently. */
  injuryCautions: MatchedCaution[]
  exercises: SnapshotExercise[]
  /** Exercises with a %1RM target but no logged sets to estimate a 1RM from. */
  missingMaxFor: string[]
}

export interface PlanAthlete {
  paces: TrainingPaces | null
  estimatedMaxKg: Record<number, number>
  injuryNotes: InjuryNoteLike[]
}

/** One number for the round across nested repeats (outer round 2 of an inner 3-round repeat is 4, 5, 6). */
function flatRound(segment: TimelineSegment): number | null {
  if (!segment.rounds?.length) return segment.round ?? null
  return segment.rounds.reduce((total, round) => total * round.of + (round.round - 1), 0) + 1
}

/**
 * The one spelling of a segment's key, `step:round:set` with `:kind` for anything but work, used by
 * the plan, the player's logged sets and the server's "is this set in the routine" check.
 */
export function segmentKey(segment: { stepId: string, round?: number | null, set?: number | null, kind?: string }) {
  const base = `${segment.stepId}:${segment.round ?? 0}:${segment.set ?? 0}`
  return !segment.kind || segment.kind === 'work' ? base : `${base}:${segment.kind}`
}

export function planSession(snapshot: AssignmentSnapshot, athlete: PlanAthlete): SessionPlan {
  const timeline = buildTimeline(snapshot.steps, { paces: athlete.paces ?? undefined })
  const exercises = new Map(snapshot.exercises.map(exercise => [exercise.id, exercise]))
  const missingMax = new Set<string>()

  const segments = timeline.segments.map((segment, index): PlanSegment => {
    const exercise = segment.exerciseId ? exercises.get(segment.exerciseId) : undefined
    const isRest = segment.kind === 'rest' || segment.kind === 'recovery'
    const target: Target | undefined = isRest && segment.set ? undefined : segment.target
    let targetKg: number | null = null
    let percent: number | null = null
    if (target?.type === 'load') targetKg = target.kg
    if (target?.type === 'percent1rm') {
      percent = target.percent
      const max = segment.exerciseId ? athlete.estimatedMaxKg[segment.exerciseId] : undefined
      if (max) targetKg = loadForPercent(max, target.percent)
      else missingMax.add(exercise?.name ?? 'an exercise')
    }
    const round = flatRound(segment)
    const measure = segment.measure
    const stepCautions = isRest && segment.set ? [] : stepCautionsFor({ kind: segment.kind, grade: segment.grade, target, exerciseCategory: exercise?.category })
    return {
      index,
      key: segmentKey({ stepId: segment.stepId, round, set: segment.set, kind: segment.kind }),
      stepId: segment.stepId,
      kind: segment.kind,
      label: segment.kind === 'rest' && segment.set ? 'Rest' : exercise?.name ?? segment.label,
      exerciseId: segment.exerciseId ?? null,
      startS: segment.startS,
      durationS: segment.durationS,
      estimated: segment.estimated,
      manual: measure.by !== 'time',
      measure: measure.by,
      reps: measure.by === 'reps' ? measure.reps : null,
      meters: measure.by === 'distance' ? measure.meters : null,
      seconds: measure.by === 'time' ? measure.seconds : null,
      set: segment.set ?? null,
      sets: segment.setOf ?? null,
      round,
      rounds: segment.rounds?.length ? segment.rounds.reduce((total, item) => total * item.of, 1) : (segment.roundOf ?? null),
      grade: segment.grade ?? null,
      targetPaceSPerKm: segment.targetPace ?? null,
      targetZone: target?.type === 'pace' ? target.zone : null,
      targetKg,
      targetRpe: target?.type === 'effort' ? target.rpe : null,
      percent1rm: percent,
      note: segment.note ?? null,
      loggable: segment.kind === 'work',
      hasCautions: Boolean(exercise?.cautions.length) || stepCautions.length > 0,
      stepCautions,
    }
  })

  const used = snapshot.exercises.filter(exercise => segments.some(segment => segment.exerciseId === exercise.id))
  const categories = [snapshot.category, ...used.map(exercise => exercise.category)]
  const equipment = [...new Set(used.flatMap(exercise => exercise.equipment))].sort((a, b) => a.localeCompare(b))
  const injuryCautions = matchCautions(used, athlete.injuryNotes, snapshot.steps).filter(caution => caution.matchedAreas.length > 0)
  return {
    title: snapshot.title,
    category: snapshot.category,
    description: snapshot.description,
    segments,
    totals: timeline.totals,
    equipment,
    generalCautions: generalCautions(categories),
    injuryCautions,
    exercises: snapshot.exercises,
    missingMaxFor: [...missingMax],
  }
}
