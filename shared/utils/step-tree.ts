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

// Edits of the tree. Each takes the steps and gives back a new tree (the input is left as it was),
// or null when the edit is not allowed; the builder's store wraps them with its undo history.

/** The id that names the routine's own top-level list (any other list is named by its repeat's id). */
export const ROOT_LIST = 'root'

export interface StepPlace {
  /** `ROOT_LIST` for the routine's own list, otherwise the id of the repeat holding the list. */
  listId: string
  index: number
}

/** The list a list id names: the routine's own, or a repeat's steps; null for anything else. */
export function listAt(steps: RoutineStep[], listId: string): RoutineStep[] | null {
  if (listId === ROOT_LIST) return steps
  const found = locate(steps, listId)
  return found?.step.type === 'repeat' ? found.step.steps : null
}

/** How many repeats hold the steps of a list (0 for the routine's own). */
export function listDepth(steps: RoutineStep[], listId: string): number {
  if (listId === ROOT_LIST) return 0
  const found = locate(steps, listId)
  return found ? found.depth + 1 : 0
}

export function placeOf(steps: RoutineStep[], id: string): StepPlace | null {
  const found = locate(steps, id)
  return found ? { listId: found.parent?.id ?? ROOT_LIST, index: found.index } : null
}

export const canMoveUp = (steps: RoutineStep[], id: string) => (locate(steps, id)?.index ?? 0) > 0
export function canMoveDown(steps: RoutineStep[], id: string) {
  const found = locate(steps, id)
  return Boolean(found && found.index < found.list.length - 1)
}
export function canIndent(steps: RoutineStep[], id: string, maxNesting: number) {
  const found = locate(steps, id)
  const above = found && found.index > 0 ? found.list[found.index - 1] : undefined
  return Boolean(found && above?.type === 'repeat' && found.depth + 1 + repeatHeight(found.step) <= maxNesting)
}
export const canOutdent = (steps: RoutineStep[], id: string) => Boolean(locate(steps, id)?.parent)

/** Runs an edit on a copy of the tree; the edit answers false to refuse. */
function edited(steps: RoutineStep[], edit: (copy: RoutineStep[]) => boolean): RoutineStep[] | null {
  const copy = clone(steps)
  return edit(copy) ? copy : null
}

/** Puts a step into a list (at its end unless an index is given), if the nesting stays within `maxNesting`. */
export function insertStep(steps: RoutineStep[], step: RoutineStep, listId: string, maxNesting: number, index?: number) {
  return edited(steps, (copy) => {
    const list = listAt(copy, listId)
    if (!list || listDepth(copy, listId) + repeatHeight(step) > maxNesting) return false
    list.splice(index ?? list.length, 0, clone(step))
    return true
  })
}

export function removeStep(steps: RoutineStep[], id: string) {
  return edited(steps, (copy) => {
    const found = locate(copy, id)
    if (!found) return false
    found.list.splice(found.index, 1)
    return true
  })
}

/**
 * Sets fields of a step (never its id or type); a `null` or `undefined` value removes an optional field.
 */
export function patchStep(steps: RoutineStep[], id: string, patch: Record<string, unknown>) {
  return edited(steps, (copy) => {
    const found = locate(copy, id)
    if (!found) return false
    const target = found.step as unknown as Record<string, unknown>
    for (const [key, value] of Object.entries(patch)) {
      if (key === 'id' || key === 'type') continue
      if (value === null || value === undefined) Reflect.deleteProperty(target, key)
      else target[key] = clone(value)
    }
    return true
  })
}

/** Moves a step one place up (-1) or down (+1) within its own list. */
export function shiftStep(steps: RoutineStep[], id: string, by: -1 | 1) {
  return edited(steps, (copy) => {
    const found = locate(copy, id)
    if (!found || found.index + by < 0 || found.index + by >= found.list.length) return false
    const [step] = found.list.splice(found.index, 1)
    found.list.splice(found.index + by, 0, step!)
    return true
  })
}

/** Moves a step into the repeat just above it, as that repeat's last step. */
export function indentStep(steps: RoutineStep[], id: string, maxNesting: number) {
  if (!canIndent(steps, id, maxNesting)) return null
  return edited(steps, (copy) => {
    const found = locate(copy, id)!
    const above = found.list[found.index - 1] as RepeatStep
    const [step] = found.list.splice(found.index, 1)
    above.steps.push(step!)
    return true
  })
}

/** Moves a step out of its repeat, to just after that repeat. */
export function outdentStep(steps: RoutineStep[], id: string) {
  return edited(steps, (copy) => {
    const found = locate(copy, id)
    if (!found?.parent) return false
    const parentPlace = locate(copy, found.parent.id)!
    const [step] = found.list.splice(found.index, 1)
    parentPlace.list.splice(parentPlace.index + 1, 0, step!)
    return true
  })
}

/**
 * A drag from one list position to another. `to.index` is the position in the target list once the
 * step has left its old place, as the drag library reports it. Refuses a repeat dropped into itself,
 * nesting beyond `maxNesting` and a drop on the same place.
 */
export function moveStep(steps: RoutineStep[], from: StepPlace, to: StepPlace, maxNesting: number) {
  return edited(steps, (copy) => {
    const source = listAt(copy, from.listId)
    const target = listAt(copy, to.listId)
    const step = source?.[from.index]
    if (!source || !target || !step) return false
    if (to.listId === step.id || (to.listId !== ROOT_LIST && contains(step, to.listId))) return false
    if (listDepth(copy, to.listId) + repeatHeight(step) > maxNesting) return false
    if (from.listId === to.listId && from.index === to.index) return false
    source.splice(from.index, 1)
    target.splice(Math.min(Math.max(to.index, 0), target.length), 0, step)
    return true
  })
}
