import { describe, expect, it } from 'vitest'
import type { RoutineStep } from '../../shared/schemas/routine-steps'
import {
  canIndent,
  canMoveDown,
  canMoveUp,
  canOutdent,
  contains,
  indentStep,
  insertStep,
  listAt,
  listDepth,
  locate,
  locatePath,
  makeBlock,
  makeRepeat,
  makeSets,
  moveStep,
  outdentStep,
  patchStep,
  placeOf,
  removeStep,
  repeatHeight,
  ROOT_LIST,
  shiftStep,
  withFreshIds,
} from '../../shared/utils/step-tree'

const tree = (): RoutineStep[] => [
  { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 600 } },
  { id: 'outer', type: 'repeat', times: 2, steps: [
    { id: 'inner', type: 'repeat', times: 3, steps: [
      { id: 'up', type: 'block', kind: 'work', measure: { by: 'time', seconds: 45 } },
    ] },
    { id: 'jog', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 120 } },
  ] },
]

describe('step tree', () => {
  it('finds a nested step with its list, parent and depth', () => {
    const steps = tree()
    const found = locate(steps, 'up')!
    expect(found.step.id).toBe('up')
    expect(found.parent?.id).toBe('inner')
    expect(found.depth).toBe(2)
    expect(found.index).toBe(0)
    expect(locate(steps, 'nowhere')).toBeNull()
  })

  it('maps a validation path to the innermost step and the field left over', () => {
    expect(locatePath(tree(), 'steps.1.steps.0.steps.0.measure.seconds'.split('.'))).toEqual({ stepId: 'up', field: 'measure.seconds' })
    expect(locatePath(tree(), ['steps', 1, 'times'])).toEqual({ stepId: 'outer', field: 'times' })
    expect(locatePath(tree(), ['steps', 1])).toEqual({ stepId: 'outer', field: '_' })
    expect(locatePath(tree(), ['steps', 9, 'times'])).toBeNull()
    expect(locatePath(tree(), ['title'])).toBeNull()
  })

  it('measures how deep repeats go and which repeat holds which step', () => {
    const [warm, outer] = tree()
    expect(repeatHeight(warm!)).toBe(0)
    expect(repeatHeight(outer!)).toBe(2)
    expect(contains(outer!, 'up')).toBe(true)
    expect(contains(outer!, 'warm')).toBe(false)
  })

  it('copies a step with fresh ids everywhere inside and leaves the original alone', () => {
    const original = tree()[1]!
    const copy = withFreshIds(original)
    const ids = (step: RoutineStep): string[] => [step.id, ...(step.type === 'repeat' ? step.steps.flatMap(ids) : [])]
    expect(ids(copy)).toHaveLength(4)
    expect(ids(copy).some(id => ids(original).includes(id))).toBe(false)
    expect(ids(original)).toEqual(['outer', 'inner', 'up', 'jog'])
  })

  it('makes new steps with unique ids and independent defaults', () => {
    const a = makeBlock('warmup')
    const b = makeBlock('warmup')
    expect(a.id).not.toBe(b.id)
    a.measure = { by: 'time', seconds: 1 }
    expect(b.measure).toEqual({ by: 'time', seconds: 600 })
    expect(makeSets(4)).toMatchObject({ type: 'sets', exerciseId: 4, sets: 3 })
    expect(makeRepeat(5).steps.map(step => step.type === 'block' && step.kind)).toEqual(['work', 'recovery'])
  })
})

describe('tree edits', () => {
  const MAX = 3
  const shape = (steps: RoutineStep[]): unknown[] => steps.map(step => (step.type === 'repeat' ? { [step.id]: shape(step.steps) } : step.id))

  it('leave the tree they were given as it was', () => {
    const steps = tree()
    const before = JSON.stringify(steps)
    shiftStep(steps, 'warm', 1)
    removeStep(steps, 'jog')
    outdentStep(steps, 'up')
    patchStep(steps, 'warm', { note: 'easy' })
    moveStep(steps, { listId: ROOT_LIST, index: 0 }, { listId: 'outer', index: 0 }, MAX)
    expect(JSON.stringify(steps)).toBe(before)
  })

  it('finds lists, their depth and a step\'s place', () => {
    const steps = tree()
    expect(listAt(steps, ROOT_LIST)).toBe(steps)
    expect(listAt(steps, 'inner')?.map(step => step.id)).toEqual(['up'])
    expect(listAt(steps, 'warm')).toBeNull()
    expect(listAt(steps, 'nowhere')).toBeNull()
    expect(listDepth(steps, ROOT_LIST)).toBe(0)
    expect(listDepth(steps, 'inner')).toBe(2)
    expect(placeOf(steps, 'jog')).toEqual({ listId: 'outer', index: 1 })
    expect(placeOf(steps, 'warm')).toEqual({ listId: ROOT_LIST, index: 0 })
    expect(placeOf(steps, 'nowhere')).toBeNull()
  })

  it('shifts a step within its list and refuses at the ends', () => {
    const steps = tree()
    expect(canMoveUp(steps, 'warm')).toBe(false)
    expect(canMoveDown(steps, 'warm')).toBe(true)
    expect(shiftStep(steps, 'warm', -1)).toBeNull()
    expect(shape(shiftStep(steps, 'warm', 1)!)).toEqual([{ outer: [{ inner: ['up'] }, 'jog'] }, 'warm'])
    expect(shape(shiftStep(steps, 'jog', -1)!)).toEqual(['warm', { outer: ['jog', { inner: ['up'] }] }])
    expect(canMoveDown(steps, 'jog')).toBe(false)
    expect(shiftStep(steps, 'jog', 1)).toBeNull()
  })

  it('removes a nested step and refuses an unknown one', () => {
    expect(shape(removeStep(tree(), 'up')!)).toEqual(['warm', { outer: [{ inner: [] }, 'jog'] }])
    expect(removeStep(tree(), 'nowhere')).toBeNull()
  })

  it('inserts within the nesting limit only', () => {
    const steps = tree()
    expect(shape(insertStep(steps, makeBlock('cooldown'), ROOT_LIST, MAX, 1)!)[1]).toMatch(/^s/)
    expect(insertStep(steps, { ...makeRepeat(2), id: 'deep' }, 'inner', MAX)?.length).toBe(2)
    expect(insertStep(steps, makeRepeat(2, [makeRepeat(2)]), 'inner', MAX)).toBeNull()
    expect(insertStep(steps, makeBlock(), 'warm', MAX)).toBeNull()
  })

  it('indents into the repeat above and outdents to just after the repeat', () => {
    const steps: RoutineStep[] = [...tree(), makeBlock('cooldown')]
    const cool = steps[2]!.id
    expect(canIndent(steps, 'warm', MAX)).toBe(false)
    expect(canIndent(steps, cool, MAX)).toBe(true)
    expect(shape(indentStep(steps, cool, MAX)!)).toEqual(['warm', { outer: [{ inner: ['up'] }, 'jog', cool] }])
    expect(indentStep(steps, 'warm', MAX)).toBeNull()
    // A repeat two deep cannot go into a repeat when only two levels are allowed.
    const nested: RoutineStep[] = [makeRepeat(2), { ...makeRepeat(2, [makeRepeat(2)]), id: 'tall' }]
    expect(canIndent(nested, 'tall', 2)).toBe(false)
    expect(canOutdent(steps, 'up')).toBe(true)
    expect(shape(outdentStep(steps, 'up')!)).toEqual(['warm', { outer: [{ inner: [] }, 'up', 'jog'] }, cool])
    expect(canOutdent(steps, 'warm')).toBe(false)
    expect(outdentStep(steps, 'warm')).toBeNull()
  })

  it('moves by drag between lists, refusing a repeat into itself, too deep, or to its own place', () => {
    const steps = tree()
    expect(shape(moveStep(steps, { listId: ROOT_LIST, index: 0 }, { listId: 'inner', index: 1 }, MAX)!)).toEqual([{ outer: [{ inner: ['up', 'warm'] }, 'jog'] }])
    expect(shape(moveStep(steps, { listId: 'inner', index: 0 }, { listId: ROOT_LIST, index: 0 }, MAX)!)).toEqual(['up', 'warm', { outer: [{ inner: [] }, 'jog'] }])
    expect(moveStep(steps, { listId: ROOT_LIST, index: 1 }, { listId: 'inner', index: 0 }, MAX)).toBeNull()
    expect(moveStep(steps, { listId: ROOT_LIST, index: 1 }, { listId: 'outer', index: 0 }, MAX)).toBeNull()
    expect(moveStep(steps, { listId: 'outer', index: 0 }, { listId: 'outer', index: 0 }, MAX)).toBeNull()
    expect(moveStep(steps, { listId: 'outer', index: 0 }, { listId: ROOT_LIST, index: 0 }, 0)).toBeNull()
    expect(moveStep(steps, { listId: ROOT_LIST, index: 5 }, { listId: ROOT_LIST, index: 0 }, MAX)).toBeNull()
  })

  it('patches fields but never the id or type, and drops fields set to null', () => {
    const steps = tree()
    const patched = patchStep(steps, 'warm', { id: 'x', type: 'repeat', note: 'relaxed', measure: { by: 'distance', meters: 1000 } })!
    expect(patched[0]).toEqual({ id: 'warm', type: 'block', kind: 'warmup', note: 'relaxed', measure: { by: 'distance', meters: 1000 } })
    expect(patchStep(patched, 'warm', { note: null })![0]).not.toHaveProperty('note')
    expect(patchStep(steps, 'nowhere', { note: 'x' })).toBeNull()
  })
})
