import type { AssignmentSnapshot, SnapshotExercise } from '../types/domain'
import { generalCautions, matchCautions, type InjuryNoteLike, type MatchedCaution } from './cautions'
import type { TrainingPaces } from './pace'
import { loadForPercent } from './strength'
import { buildTimeline, type BlockKind, type RoutineStep, type Target } from './timeline'

// What the player runs: the assignment's snapshot turned into one athlete's segments, with their
// paces and loads filled in and the cautions that concern them.

export interface PlanSegment {
  index: number
  /** Unique within the session: step, round and set; entries are logged against it. */
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
  hasCautions: boolean
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

const kindLabels: Record<BlockKind, string> = { warmup: 'Warm-up', work: 'Work', recovery: 'Recovery', rest: 'Rest', cooldown: 'Cool-down' }

interface StepInfo {
  step: RoutineStep
  rounds: number | null
}

function indexSteps(steps: RoutineStep[], rounds: number | null = null, into = new Map<string, StepInfo>()) {
  for (const step of steps) {
    into.set(step.id, { step, rounds })
    if (step.type === 'repeat') indexSteps(step.steps, step.times, into)
  }
  return into
}

export function planSession(snapshot: AssignmentSnapshot, athlete: PlanAthlete): SessionPlan {
  const timeline = buildTimeline(snapshot.steps, { paces: athlete.paces ?? undefined })
  const steps = indexSteps(snapshot.steps)
  const exercises = new Map(snapshot.exercises.map(exercise => [exercise.id, exercise]))
  const missingMax = new Set<string>()

  const segments = timeline.segments.map((segment, index): PlanSegment => {
    const info = steps.get(segment.stepId)
    const step = info?.step
    const exercise = segment.exerciseId ? exercises.get(segment.exerciseId) : undefined
    const isSetRest = step?.type === 'sets' && segment.kind === 'rest'
    const measure = step?.type === 'sets' ? (isSetRest ? { by: 'time' as const, seconds: step.restSeconds } : step.perSet) : step?.type === 'block' ? step.measure : { by: 'time' as const, seconds: segment.durationS }
    const target: Target | undefined = isSetRest ? undefined : (segment.target ?? (step && step.type !== 'repeat' ? step.target : undefined))
    let targetKg: number | null = null
    let percent: number | null = null
    if (target?.type === 'load') targetKg = target.kg
    if (target?.type === 'percent1rm') {
      percent = target.percent
      const max = segment.exerciseId ? athlete.estimatedMaxKg[segment.exerciseId] : undefined
      if (max) targetKg = loadForPercent(max, target.percent)
      else missingMax.add(exercise?.name ?? 'an exercise')
    }
    const loggable = !isSetRest && (segment.kind === 'work')
    const grade = step?.type === 'block' ? (step.grade ?? null) : null
    return {
      index,
      key: `${segment.stepId}:${segment.round ?? 0}:${segment.set ?? 0}`,
      stepId: segment.stepId,
      kind: segment.kind,
      label: isSetRest ? 'Rest' : exercise?.name ?? kindLabels[segment.kind],
      exerciseId: isSetRest ? null : (segment.exerciseId ?? null),
      startS: segment.startS,
      durationS: segment.durationS,
      estimated: segment.estimated,
      manual: measure.by !== 'time',
      measure: measure.by,
      reps: measure.by === 'reps' ? measure.reps : null,
      meters: measure.by === 'distance' ? measure.meters : null,
      seconds: measure.by === 'time' ? measure.seconds : null,
      set: segment.set ?? null,
      sets: step?.type === 'sets' ? step.sets : null,
      round: segment.round ?? null,
      rounds: info?.rounds ?? null,
      grade,
      targetPaceSPerKm: segment.targetPace ?? null,
      targetZone: target?.type === 'pace' ? target.zone : null,
      targetKg,
      targetRpe: target?.type === 'effort' ? target.rpe : null,
      percent1rm: percent,
      note: step && step.type !== 'repeat' ? (step.note ?? null) : null,
      loggable,
      hasCautions: Boolean(!isSetRest && exercise?.cautions.length),
    }
  })

  const used = snapshot.exercises.filter(exercise => segments.some(segment => segment.exerciseId === exercise.id))
  const categories = [snapshot.category, ...used.map(exercise => exercise.category)]
  const equipment = [...new Set(used.flatMap(exercise => exercise.equipment))].sort((a, b) => a.localeCompare(b))
  const injuryCautions = matchCautions(used, athlete.injuryNotes).filter(caution => caution.matchedAreas.length > 0)
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
