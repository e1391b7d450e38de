import type { Measure, RoutineStep, Target } from '../schemas/routine-steps'
import { formatDuration } from './pace'
import { blockKinds, effortWords, paceZones, plural, stepTypeLabels } from './vocabulary'

// Plain words for the parts of a step, shared by the builder, the preview and the print card.

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
  return plural(measure.reps, 'rep')
}

export function describeTarget(target: Target | undefined): string {
  if (!target) return ''
  if (target.type === 'pace') return paceZones.labels[target.zone]
  if (target.type === 'effort') return `effort ${target.rpe} of 10 (${effortWords(target.rpe).toLowerCase()})`
  if (target.type === 'load') return `${target.kg} kg`
  return `${target.percent} % of 1RM`
}

export function formatGrade(grade: number): string {
  const percent = Math.round(grade * 1000) / 10
  return `${percent > 0 ? '+' : ''}${percent} % grade`
}

/** A one-line summary, e.g. "Effort · 60 s · 5K pace · +6 % grade" or "Split squat · 3 × 8 reps". */
export function describeStep(step: RoutineStep, exerciseName?: (id: number) => string | undefined): string {
  if (step.type === 'repeat') return `${plural(step.times, 'round')} of ${plural(step.steps.length, 'step')}`
  const name = step.exerciseId ? exerciseName?.(step.exerciseId) : undefined
  if (step.type === 'sets') {
    return [name ?? 'Sets', `${step.sets} × ${describeMeasure(step.perSet)}`, describeTarget(step.target)].filter(Boolean).join(' · ')
  }
  return [blockKinds.labels[step.kind], name, describeMeasure(step.measure), describeTarget(step.target), step.grade ? formatGrade(step.grade) : '']
    .filter(Boolean).join(' · ')
}

/** A short name for buttons and screen readers: "Easy start", "Split squat sets", "8 rounds". */
export function stepName(step: RoutineStep, exerciseName?: (id: number) => string | undefined): string {
  if (step.type === 'repeat') return plural(step.times, 'round')
  const name = step.exerciseId ? exerciseName?.(step.exerciseId) : undefined
  if (step.type === 'sets') return name ? `${name} sets` : stepTypeLabels.sets
  return name ? `${blockKinds.labels[step.kind]}: ${name}` : blockKinds.labels[step.kind]
}

/** What the card shows under the step's name: the numbers, without repeating the kind or exercise. */
export function describeStepDetails(step: RoutineStep): string {
  if (step.type === 'repeat') {
    const count = step.steps.length
    return `${plural(step.times, 'round')} of ${plural(count, 'step')}${step.skipLastRecovery ? ', ends on the last effort' : ''}`
  }
  if (step.type === 'sets') {
    return [`${step.sets} × ${describeMeasure(step.perSet)}`, `${formatSeconds(step.restSeconds)} rest`, describeTarget(step.target)].filter(Boolean).join(' · ')
  }
  return [describeMeasure(step.measure), describeTarget(step.target), step.grade ? formatGrade(step.grade) : ''].filter(Boolean).join(' · ')
}

/** The name of every step in a tree by its id, for screens that hold only a step id (the logbook). */
export function stepNamesById(steps: readonly RoutineStep[], exerciseName?: (id: number) => string | undefined): Map<string, string> {
  const names = new Map<string, string>()
  const visit = (list: readonly RoutineStep[]) => {
    for (const step of list) {
      names.set(step.id, stepName(step, exerciseName))
      if (step.type === 'repeat') visit(step.steps)
    }
  }
  visit(steps)
  return names
}
