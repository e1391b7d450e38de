import type { BlockKind, Measure, PaceZone, RoutineStep, Target } from '../schemas/routine-steps'
import { formatDuration } from './pace'

// Plain words for the parts of a step, shared by the builder, the preview and the print card.

export const blockKindLabels: Record<BlockKind, string> = {
  warmup: 'Warm-up',
  work: 'Effort',
  recovery: 'Recovery',
  rest: 'Rest',
  cooldown: 'Cool-down',
}

export const paceZoneLabels: Record<PaceZone, string> = {
  easy: 'Easy pace',
  marathon: 'Marathon pace',
  threshold: 'Threshold pace',
  tenK: '10K pace',
  fiveK: '5K pace',
  mile: 'Mile pace',
}

export function formatSeconds(seconds: number): string {
  if (seconds < 60) return `${Math.round(seconds)} s`
  return formatDuration(seconds)
}

export function formatMeters(meters: number): string {
  return meters >= 1000 ? `${(meters / 1000).toLocaleString('en-GB', { maximumFractionDigits: 2 })} km` : `${Math.round(meters)} m`
}

export function describeMeasure(measure: Measure): string {
  if (measure.by === 'time') return formatSeconds(measure.seconds)
  if (measure.by === 'distance') return formatMeters(measure.meters)
  return `${measure.reps} reps`
}

export function describeTarget(target: Target | undefined): string {
  if (!target) return ''
  if (target.type === 'pace') return paceZoneLabels[target.zone]
  if (target.type === 'effort') return `RPE ${target.rpe}`
  if (target.type === 'load') return `${target.kg} kg`
  return `${target.percent} % of 1RM`
}

export function formatGrade(grade: number): string {
  const percent = Math.round(grade * 1000) / 10
  return `${percent > 0 ? '+' : ''}${percent} % grade`
}

/** A one-line summary, e.g. "Effort · 60 s · 5K pace · +6 % grade" or "Split squat · 3 × 8 reps". */
export function describeStep(step: RoutineStep, exerciseName?: (id: number) => string | undefined): string {
  if (step.type === 'repeat') return `${step.times} × ${step.steps.length} step${step.steps.length === 1 ? '' : 's'}`
  const name = step.exerciseId ? exerciseName?.(step.exerciseId) : undefined
  if (step.type === 'sets') {
    return [name ?? 'Sets', `${step.sets} × ${describeMeasure(step.perSet)}`, describeTarget(step.target)].filter(Boolean).join(' · ')
  }
  return [blockKindLabels[step.kind], name, describeMeasure(step.measure), describeTarget(step.target), step.grade ? formatGrade(step.grade) : '']
    .filter(Boolean).join(' · ')
}

/** A short name for buttons and screen readers: "Warm-up", "Split squat sets", "Repeat 8 times". */
export function stepName(step: RoutineStep, exerciseName?: (id: number) => string | undefined): string {
  if (step.type === 'repeat') return `Repeat ${step.times} times`
  const name = step.exerciseId ? exerciseName?.(step.exerciseId) : undefined
  if (step.type === 'sets') return `${name ?? 'Exercise'} sets`
  return name ? `${blockKindLabels[step.kind]}: ${name}` : blockKindLabels[step.kind]
}

/** What the card shows under the step's name: the numbers, without repeating the kind or exercise. */
export function describeStepDetails(step: RoutineStep): string {
  if (step.type === 'repeat') {
    const count = step.steps.length
    return `${step.times} round${step.times === 1 ? '' : 's'} of ${count} step${count === 1 ? '' : 's'}${step.skipLastRecovery ? ', no recovery after the last' : ''}`
  }
  if (step.type === 'sets') {
    return [`${step.sets} × ${describeMeasure(step.perSet)}`, `${formatSeconds(step.restSeconds)} rest`, describeTarget(step.target)].filter(Boolean).join(' · ')
  }
  return [describeMeasure(step.measure), describeTarget(step.target), step.grade ? formatGrade(step.grade) : ''].filter(Boolean).join(' · ')
}
