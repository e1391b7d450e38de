import { describe, expect, it } from 'vitest'
import type { RoutineStep } from '../../shared/schemas/routine-steps'
import { contains, locate, locatePath, makeBlock, makeRepeat, makeSets, repeatHeight, withFreshIds } from '../../shared/utils/step-tree'

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
