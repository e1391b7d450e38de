import type { BlockKind, BlockStep, RepeatStep, RoutineStep, SetsStep } from '../schemas/routine-steps'

// The routine's step tree as plain data: making steps, finding them and measuring nesting. Pure
// functions, so the builder's store, the server and tests share them (tests/unit/step-tree.test.ts).

export interface StepLocation {
  list: RoutineStep[]
  index: number
  step: RoutineStep
  parent: RepeatStep | null
  /** How many repeats hold this step's list (0 at the top level). */
  depth: number
}

let idCounter = 0
export function newStepId(): string {
  idCounter += 1
  return `s${Date.now().toString(36)}${idCounter.toString(36)}${Math.random().toString(36).slice(2, 6)}`
}

export const clone = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T

/** A deep copy of a step with fresh ids throughout, for duplicating. */
export function withFreshIds(step: RoutineStep): RoutineStep {
  const copy = clone(step)
  const renew = (item: RoutineStep) => {
    item.id = newStepId()
    if (item.type === 'repeat') item.steps.forEach(renew)
  }
  renew(copy)
  return copy
}

const defaultBlocks: Record<BlockKind, Omit<BlockStep, 'id' | 'type' | 'kind'>> = {
  warmup: { measure: { by: 'time', seconds: 600 }, target: { type: 'pace', zone: 'easy' } },
  work: { measure: { by: 'time', seconds: 60 }, target: { type: 'effort', rpe: 8 } },
  recovery: { measure: { by: 'time', seconds: 90 } },
  rest: { measure: { by: 'time', seconds: 60 } },
  cooldown: { measure: { by: 'time', seconds: 600 }, target: { type: 'pace', zone: 'easy' } },
}

export function makeBlock(kind: BlockKind = 'work'): BlockStep {
  return { id: newStepId(), type: 'block', kind, ...clone(defaultBlocks[kind]) }
}

/** `exerciseId` 0 means "not picked yet": the schema flags it until the coach picks one. */
export function makeSets(exerciseId = 0): SetsStep {
  return { id: newStepId(), type: 'sets', exerciseId, sets: 3, perSet: { by: 'reps', reps: 8 }, restSeconds: 90 }
}

export function makeRepeat(times = 4, steps?: RoutineStep[]): RepeatStep {
  return { id: newStepId(), type: 'repeat', times, steps: steps ?? [makeBlock('work'), makeBlock('recovery')] }
}

/** How deep repeats go inside a step: 0 for a block or sets, 1 for a repeat of plain steps. */
export function repeatHeight(step: RoutineStep): number {
  if (step.type !== 'repeat') return 0
  return 1 + Math.max(0, ...step.steps.map(repeatHeight))
}

export function contains(step: RoutineStep, id: string): boolean {
  return step.type === 'repeat' && step.steps.some(child => child.id === id || contains(child, id))
}

export function locate(steps: RoutineStep[], id: string, parent: RepeatStep | null = null, depth = 0): StepLocation | null {
  for (let index = 0; index < steps.length; index++) {
    const step = steps[index]!
    if (step.id === id) return { list: steps, index, step, parent, depth }
    if (step.type === 'repeat') {
      const found = locate(step.steps, id, step, depth + 1)
      if (found) return found
    }
  }
  return null
}

/**
 * Where a validation path (`['steps', 2, 'steps', 0, 'measure', 'seconds']` or `steps.2.steps.0.measure.seconds`)
 * lands: the innermost step it reaches and the field left over ('_' for the step itself).
 */
export function locatePath(steps: RoutineStep[], path: (string | number)[]): { stepId: string, field: string } | null {
  const parts = path.map(part => (typeof part === 'string' && /^\d+$/.test(part) ? Number(part) : part))
  if (parts[0] !== 'steps' || typeof parts[1] !== 'number') return null
  let step = steps[parts[1]]
  if (!step) return null
  let rest = parts.slice(2)
  while (step.type === 'repeat' && rest[0] === 'steps' && typeof rest[1] === 'number' && step.steps[rest[1]]) {
    step = step.steps[rest[1]]!
    rest = rest.slice(2)
  }
  return { stepId: step.id, field: rest.length ? rest.join('.') : '_' }
}
