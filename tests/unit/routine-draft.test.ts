import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import { HISTORY_LIMIT, ROOT, useRoutineDraftStore } from '../../stores/routineDraft'
import { locatePath } from '../../shared/utils/step-tree'
import type { BlockStep, RepeatStep, RoutineStep } from '../../shared/schemas/routine-steps'

const block = (id: string, kind: BlockStep['kind'], seconds: number, extra: Partial<BlockStep> = {}): BlockStep =>
  ({ id, type: 'block', kind, measure: { by: 'time', seconds }, ...extra })

/** The hill session of the builder's browser test: warm-up, 8 × [60 s uphill, 90 s jog down], cool-down. */
function hillRoutine(): RoutineStep[] {
  return [
    block('warm', 'warmup', 600),
    {
      id: 'hills',
      type: 'repeat',
      times: 8,
      steps: [
        block('up', 'work', 60, { target: { type: 'pace', zone: 'fiveK' }, grade: 0.06 }),
        block('down', 'recovery', 90),
      ],
    },
    block('cool', 'cooldown', 600),
  ]
}

const ids = (steps: RoutineStep[]): unknown[] => steps.map(step => (step.type === 'repeat' ? { [step.id]: ids(step.steps) } : step.id))

let draft: ReturnType<typeof useRoutineDraftStore>

beforeEach(() => {
  setActivePinia(createPinia())
  draft = useRoutineDraftStore()
  draft.load({ id: 7, version: 3, title: 'Short hills', category: 'hills', description: '', steps: hillRoutine() })
})

describe('loading', () => {
  it('starts clean, with no history, and the loaded version', () => {
    expect(draft.dirty).toBe(false)
    expect(draft.canUndo).toBe(false)
    expect(draft.version).toBe(3)
    expect(draft.payload()).toMatchObject({ title: 'Short hills', version: 3 })
  })

  it('reset gives an empty, unsaved draft without a version', () => {
    draft.reset()
    expect(draft.routineId).toBeNull()
    expect(draft.steps).toEqual([])
    expect(draft.payload()).not.toHaveProperty('version')
  })
})

describe('reordering', () => {
  it('moves a step up and down within its list, refusing at the ends', () => {
    expect(draft.moveUp('warm')).toBe(false)
    expect(draft.moveDown('warm')).toBe(true)
    expect(ids(draft.steps)).toEqual([{ hills: ['up', 'down'] }, 'warm', 'cool'])
    expect(draft.moveDown('cool')).toBe(false)
    expect(draft.moveUp('down')).toBe(true)
    expect(ids(draft.steps)).toEqual([{ hills: ['down', 'up'] }, 'warm', 'cool'])
    expect(draft.dirty).toBe(true)
  })

  it('moves by drag within a list, reporting the index after removal', () => {
    expect(draft.move({ listId: ROOT, index: 0 }, { listId: ROOT, index: 2 })).toBe(true)
    expect(ids(draft.steps)).toEqual([{ hills: ['up', 'down'] }, 'cool', 'warm'])
  })

  it('drags a step into a repeat and back out to the top level', () => {
    expect(draft.move({ listId: ROOT, index: 2 }, { listId: 'hills', index: 1 })).toBe(true)
    expect(ids(draft.steps)).toEqual(['warm', { hills: ['up', 'cool', 'down'] }])
    expect(draft.move({ listId: 'hills', index: 0 }, { listId: ROOT, index: 0 })).toBe(true)
    expect(ids(draft.steps)).toEqual(['up', 'warm', { hills: ['cool', 'down'] }])
  })

  it('refuses to drop a repeat inside itself', () => {
    expect(draft.move({ listId: ROOT, index: 1 }, { listId: 'hills', index: 0 })).toBe(false)
    expect(draft.canUndo).toBe(false)
  })

  it('reports where a step is', () => {
    expect(draft.placeOf('down')).toEqual({ listId: 'hills', index: 1 })
    expect(draft.placeOf('cool')).toEqual({ listId: ROOT, index: 2 })
  })
})

describe('nesting', () => {
  it('indents into the repeat just above and outdents to just after it', () => {
    expect(draft.canIndent('warm')).toBe(false)
    expect(draft.canIndent('cool')).toBe(true)
    expect(draft.indent('cool')).toBe(true)
    expect(ids(draft.steps)).toEqual(['warm', { hills: ['up', 'down', 'cool'] }])
    expect(draft.canOutdent('up')).toBe(true)
    expect(draft.outdent('up')).toBe(true)
    expect(ids(draft.steps)).toEqual(['warm', { hills: ['down', 'cool'] }, 'up'])
    expect(draft.canOutdent('warm')).toBe(false)
    expect(draft.outdent('warm')).toBe(false)
  })

  it('nests repeats two levels deep and times them', () => {
    const inner = draft.addRepeat('hills', 2)!
    const innerRepeat = (draft.steps[1] as RepeatStep).steps[2] as RepeatStep
    expect(innerRepeat.id).toBe(inner)
    // 8 × (60 + 90 + 2 × (60 + 90)) = 8 × 450
    draft.updateStep(innerRepeat.steps[0]!.id, { measure: { by: 'time', seconds: 60 } })
    draft.updateStep(innerRepeat.steps[1]!.id, { measure: { by: 'time', seconds: 90 } })
    expect(draft.totals?.durationS).toBe(600 + 8 * 450 + 600)
  })

  it('stops at the deepest nesting the schema allows', () => {
    draft.reset()
    const outer = draft.addRepeat(ROOT, 2)!
    const middle = draft.addRepeat(outer, 2)!
    const inner = draft.addRepeat(middle, 2)!
    expect(inner).toBeTruthy()
    expect(draft.addRepeat(inner, 2)).toBeNull()
    expect(draft.valid).toBe(false) // the title is still empty
    expect(draft.routineErrors.title).toBeTruthy()
    expect(Object.keys(draft.stepErrors)).toEqual([])
  })
})

describe('undo and redo', () => {
  it('undoes and redoes a chain of edits', () => {
    draft.moveDown('warm')
    draft.removeStep('cool')
    draft.updateStep('up', { measure: { by: 'time', seconds: 45 } })
    expect(draft.undo()).toBe(true)
    expect((draft.steps[0] as RepeatStep).steps[0]).toMatchObject({ measure: { seconds: 60 } })
    expect(draft.undo()).toBe(true)
    expect(ids(draft.steps)).toEqual([{ hills: ['up', 'down'] }, 'warm', 'cool'])
    expect(draft.undo()).toBe(true)
    expect(ids(draft.steps)).toEqual(['warm', { hills: ['up', 'down'] }, 'cool'])
    expect(draft.dirty).toBe(false)
    expect(draft.undo()).toBe(false)
    expect(draft.redo()).toBe(true)
    expect(draft.redo()).toBe(true)
    expect(ids(draft.steps)).toEqual([{ hills: ['up', 'down'] }, 'warm'])
    expect(draft.dirty).toBe(true)
  })

  it('a new edit after undo drops the redo branch', () => {
    draft.removeStep('cool')
    draft.undo()
    expect(draft.canRedo).toBe(true)
    draft.moveDown('warm')
    expect(draft.canRedo).toBe(false)
  })

  it('merges a run of typing in one field into one undo step', () => {
    draft.setMeta('title', 'Short hill')
    draft.setMeta('title', 'Short hill r')
    draft.setMeta('title', 'Short hill reps')
    draft.updateStep('warm', { note: 'E' }, 'note')
    draft.updateStep('warm', { note: 'Easy' }, 'note')
    draft.undo()
    expect(draft.steps[0]).not.toHaveProperty('note')
    expect(draft.title).toBe('Short hill reps')
    draft.undo()
    expect(draft.title).toBe('Short hills')
  })

  it('keeps at most the history cap', () => {
    for (let index = 0; index < HISTORY_LIMIT + 20; index++) draft.updateStep('warm', { measure: { by: 'time', seconds: 100 + index } })
    let undone = 0
    while (draft.undo()) undone++
    expect(undone).toBe(HISTORY_LIMIT)
    expect(draft.steps[0]).toMatchObject({ measure: { seconds: 119 } })
  })

  it('a drag is one undo step', () => {
    draft.move({ listId: ROOT, index: 2 }, { listId: 'hills', index: 0 })
    draft.undo()
    expect(ids(draft.steps)).toEqual(['warm', { hills: ['up', 'down'] }, 'cool'])
  })
})

describe('totals', () => {
  it('adds up the hill session: 10 min + 8 × (60 s + 90 s) + 10 min', () => {
    expect(draft.totals).toMatchObject({ durationS: 600 + 1200 + 600, workS: 480, estimated: false })
  })

  it('updates as steps change', () => {
    draft.updateStep('hills', { times: 6 })
    expect(draft.totals?.durationS).toBe(600 + 900 + 600)
    draft.updateStep('hills', { skipLastRecovery: true })
    expect(draft.totals?.durationS).toBe(600 + 900 - 90 + 600)
    draft.removeStep('cool')
    expect(draft.totals?.durationS).toBe(600 + 810)
  })

  it('counts sets and reps, marking rep timings as estimated', () => {
    const id = draft.addSets(42)!
    draft.updateStep(id, { sets: 3, perSet: { by: 'reps', reps: 8 }, restSeconds: 90 })
    expect(draft.totals).toMatchObject({ sets: 3, reps: 24, estimated: true, durationS: 2400 + 3 * 8 * 3 + 2 * 90 })
  })

  it('has no totals while a step cannot be timed, and they return after undo', () => {
    draft.updateStep('up', { measure: { by: 'time', seconds: -5 } })
    expect(draft.totals).toBeNull()
    draft.undo()
    expect(draft.totals?.durationS).toBe(2400)
  })
})

describe('validation', () => {
  it('maps schema errors to the step and field that caused them', () => {
    draft.updateStep('down', { measure: { by: 'time', seconds: 0 } })
    draft.updateStep('warm', { target: { type: 'effort', rpe: 14 } })
    expect(draft.valid).toBe(false)
    expect(draft.stepErrors.down).toEqual({ 'measure.seconds': expect.stringMatching(/more than 0/) })
    expect(draft.stepErrors.warm).toEqual({ 'target.rpe': expect.stringMatching(/0 to 10/) })
    expect(draft.stepErrors.up).toBeUndefined()
  })

  it('flags a sets step without an exercise and an empty repeat', () => {
    const sets = draft.addSets()!
    draft.removeStep('up')
    draft.removeStep('down')
    expect(draft.stepErrors[sets]).toHaveProperty('exerciseId')
    expect(draft.stepErrors.hills).toHaveProperty('steps')
  })

  it('places server field errors on steps until the next edit', () => {
    draft.applyServerErrors({ 'steps.1.steps.0.exerciseId': 'This exercise is not in your library', 'title': 'Taken' })
    expect(draft.stepErrors.up).toEqual({ exerciseId: 'This exercise is not in your library' })
    expect(draft.routineErrors.title).toBe('Taken')
    draft.moveDown('warm')
    expect(draft.stepErrors.up).toBeUndefined()
  })

  it('locates dotted and array paths alike', () => {
    const steps = hillRoutine()
    expect(locatePath(steps, ['steps', 1, 'steps', 1, 'measure', 'seconds'])).toEqual({ stepId: 'down', field: 'measure.seconds' })
    expect(locatePath(steps, 'steps.1.times'.split('.'))).toEqual({ stepId: 'hills', field: 'times' })
    expect(locatePath(steps, ['steps', 0])).toEqual({ stepId: 'warm', field: '_' })
    expect(locatePath(steps, ['title'])).toBeNull()
  })

  it('is clean after saving', () => {
    draft.moveDown('warm')
    draft.markSaved({ id: 7, version: 4 })
    expect(draft.dirty).toBe(false)
    expect(draft.payload()).toMatchObject({ version: 4 })
  })

  it('duplicates a repeat with fresh ids throughout', () => {
    const copy = draft.duplicateStep('hills')!
    const repeat = draft.steps[2] as RepeatStep
    expect(repeat.id).toBe(copy)
    expect(repeat.steps.map(step => step.id)).not.toContain('up')
    expect(draft.valid).toBe(true)
  })
})

describe('totals while the draft is incomplete', () => {
  it('keeps totals while only an exercise is missing', () => {
    draft.addSets()
    expect(draft.valid).toBe(false)
    expect(draft.totals?.sets).toBe(3)
  })
})
