import type { AthleteContext } from './athlete-context'
import { hillPaceForEffort } from '#shared/utils/pace'
import { loadForPercent } from '#shared/utils/strength'
import type { RoutineStep } from '#shared/schemas/routine-steps'
import type { ResolvedTarget } from '#shared/types/routine'

/** Each target in the tree, by step id, with what it means for this athlete. */
export function resolveRoutineTargets(steps: RoutineStep[], context: AthleteContext): Record<string, ResolvedTarget> {
  const resolved: Record<string, ResolvedTarget> = {}
  const visit = (list: RoutineStep[]) => {
    for (const step of list) {
      if (step.type === 'repeat') {
        visit(step.steps)
        continue
      }
      if (!step.target) continue
      const entry: ResolvedTarget = { target: step.target }
      const grade = step.type === 'block' ? step.grade : undefined
      if (step.target.type === 'pace') {
        if (!context.paces) entry.missing = 'No benchmark race in the athlete profile'
        else {
          const zone = context.paces[step.target.zone]
          entry.pace = typeof zone === 'number' ? { fast: zone, slow: zone } : { ...zone }
          if (grade) {
            entry.grade = grade
            entry.hillPace = { fast: hillPaceForEffort(entry.pace.fast, grade), slow: hillPaceForEffort(entry.pace.slow, grade) }
          }
        }
      }
      else if (step.target.type === 'percent1rm') {
        const max = step.exerciseId ? context.estimatedMaxKg[step.exerciseId] : undefined
        if (!max) entry.missing = 'No logged sets of this exercise to estimate a 1RM from'
        else {
          entry.estimatedMaxKg = max
          entry.loadKg = loadForPercent(max, step.target.percent)
        }
      }
      else if (step.target.type === 'load') entry.loadKg = step.target.kg
      resolved[step.id] = entry
    }
  }
  visit(steps)
  return resolved
}
