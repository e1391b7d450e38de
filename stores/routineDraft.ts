import { defineStore } from 'pinia'
import { computed, ref, type Ref } from 'vue'
import { routineMetaSchema, type RoutineCategory } from '#shared/schemas/routine'
import type { ExerciseCaution } from '#shared/types/domain'
import type { BlockKind } from '#shared/utils/vocabulary'
import { buildTimeline } from '#shared/utils/timeline'
import { MAX_NESTING, routineStepsSchema, type RoutineStep } from '#shared/schemas/routine-steps'
import * as tree from '#shared/utils/step-tree'
import type { StepPlace } from '#shared/utils/step-tree'

export const ROOT = tree.ROOT_LIST
export const HISTORY_LIMIT = 100

export interface DraftExercise {
  id: number
  name: string
  category: string
  cautions: ExerciseCaution[]
  summary?: string
  cues?: string[]
  hasClip?: boolean
  archivedAt?: string | Date | null
}

export interface RoutineDraftContent {
  title: string
  category: RoutineCategory
  description: string
  steps: RoutineStep[]
}

export interface LoadedRoutine extends RoutineDraftContent {
  id: number | null
  version: number | null
  exercises?: DraftExercise[]
}

type FieldMessages = Record<string, string>

const timingFields = new Set(['measure', 'perSet', 'seconds', 'meters', 'reps', 'by', 'times', 'sets', 'restSeconds', 'type', 'kind', 'skipLastRecovery'])

export const useRoutineDraftStore = defineStore('routineDraft', () => {
  const routineId = ref<number | null>(null)
  const version = ref<number | null>(null)
  const title = ref('')
  const category = ref<RoutineCategory>('hills')
  const description = ref('')
  const steps = ref<RoutineStep[]>([])
  const exercises = ref<Record<number, DraftExercise>>({})

  const past = ref<string[]>([])
  const future = ref<string[]>([])
  let lastCoalesceKey: string | null = null
  const savedJson = ref('')
  const serverErrors = ref<FieldMessages>({})

  function content(): RoutineDraftContent {
    return { title: title.value, category: category.value, description: description.value, steps: steps.value }
  }
  const serialize = () => JSON.stringify(content())
  function restore(json: string) {
    const data = JSON.parse(json) as RoutineDraftContent
    title.value = data.title
    category.value = data.category
    description.value = data.description
    steps.value = data.steps
  }

  /** Records the state before an edit so it can be undone; edits sharing a key (typing in one field) merge. */
  function commit(edit: () => void, coalesceKey?: string) {
    if (!coalesceKey || coalesceKey !== lastCoalesceKey) {
      past.value.push(serialize())
      if (past.value.length > HISTORY_LIMIT) past.value.splice(0, past.value.length - HISTORY_LIMIT)
    }
    future.value = []
    lastCoalesceKey = coalesceKey ?? null
    serverErrors.value = {}
    edit()
  }

  function load(routine: LoadedRoutine) {
    routineId.value = routine.id
    version.value = routine.version
    restore(JSON.stringify({ title: routine.title, category: routine.category, description: routine.description, steps: routine.steps }))
    exercises.value = Object.fromEntries((routine.exercises ?? []).map(exercise => [exercise.id, exercise]))
    past.value = []
    future.value = []
    lastCoalesceKey = null
    serverErrors.value = {}
    savedJson.value = serialize()
  }

  function reset(start: Partial<RoutineDraftContent> = {}) {
    load({ id: null, version: null, title: '', category: 'hills', description: '', steps: [], ...start })
    // A fresh draft with steps from a starting point counts as unsaved work.
    if (start.steps?.length || start.title) savedJson.value = JSON.stringify({ title: '', category: 'hills', description: '', steps: [] })
  }

  function markSaved(saved: { id: number, version: number }) {
    routineId.value = saved.id
    version.value = saved.version
    savedJson.value = serialize()
    serverErrors.value = {}
  }

  const dirty = computed(() => serialize() !== savedJson.value)
  const canUndo = computed(() => past.value.length > 0)
  const canRedo = computed(() => future.value.length > 0)

  /** Undo and redo: restore the latest snapshot of one history, keeping the present in the other. */
  function travel(from: Ref<string[]>, to: Ref<string[]>) {
    const snapshot = from.value.pop()
    if (snapshot === undefined) return false
    to.value.push(serialize())
    restore(snapshot)
    lastCoalesceKey = null
    return true
  }
  const undo = () => travel(past, future)
  const redo = () => travel(future, past)

  function setMeta(field: 'title' | 'description', value: string): void
  function setMeta(field: 'category', value: RoutineCategory): void
  function setMeta(field: 'title' | 'description' | 'category', value: string) {
    if (content()[field] === value) return
    commit(() => {
      if (field === 'category') category.value = value as RoutineCategory
      else if (field === 'title') title.value = value
      else description.value = value
    }, `meta:${field}`)
  }

  /** Applies a tree edit from shared/utils/step-tree.ts; a refused edit (null) leaves history alone. */
  function edit(next: RoutineStep[] | null, coalesceKey?: string) {
    if (!next) return false
    commit(() => {
      steps.value = next
    }, coalesceKey)
    return true
  }

  const placeOf = (id: string): StepPlace | null => tree.placeOf(steps.value, id)

  function addStep(step: RoutineStep, listId = ROOT, index?: number) {
    return edit(tree.insertStep(steps.value, step, listId, MAX_NESTING, index)) ? step.id : null
  }
  const addBlock = (kind: BlockKind = 'work', listId = ROOT) => addStep(tree.makeBlock(kind), listId)
  const addSets = (exerciseId = 0, listId = ROOT) => addStep(tree.makeSets(exerciseId), listId)
  const addRepeat = (listId = ROOT, times = 4) => addStep(tree.makeRepeat(times), listId)

  function duplicateStep(id: string) {
    const found = tree.locate(steps.value, id)
    if (!found) return null
    return addStep(tree.withFreshIds(found.step), found.parent?.id ?? ROOT, found.index + 1)
  }

  /**
   * Changes fields of a step. `coalesceKey` merges a run of edits to one field (typing) into one undo step.
   * A `null` value removes an optional field.
   */
  const updateStep = (id: string, patch: Record<string, unknown>, coalesceKey?: string) =>
    edit(tree.patchStep(steps.value, id, patch), coalesceKey ? `${id}:${coalesceKey}` : undefined)
  const removeStep = (id: string) => edit(tree.removeStep(steps.value, id))

  const canMoveUp = (id: string) => tree.canMoveUp(steps.value, id)
  const canMoveDown = (id: string) => tree.canMoveDown(steps.value, id)
  const canIndent = (id: string) => tree.canIndent(steps.value, id, MAX_NESTING)
  const canOutdent = (id: string) => tree.canOutdent(steps.value, id)
  const moveUp = (id: string) => edit(tree.shiftStep(steps.value, id, -1))
  const moveDown = (id: string) => edit(tree.shiftStep(steps.value, id, 1))
  /** Moves a step into the repeat just above it, as that repeat's last step. */
  const indent = (id: string) => edit(tree.indentStep(steps.value, id, MAX_NESTING))
  /** Moves a step out of its repeat, to just after that repeat. */
  const outdent = (id: string) => edit(tree.outdentStep(steps.value, id))
  /**
   * A drag from one list position to another (lists are the routine or a repeat's steps). `to.index` is
   * the position in the target list once the step has left its old place, as the drag library reports it.
   */
  const move = (from: StepPlace, to: StepPlace) => edit(tree.moveStep(steps.value, from, to, MAX_NESTING))

  function rememberExercise(exercise: DraftExercise) {
    exercises.value = { ...exercises.value, [exercise.id]: exercise }
  }
  const exerciseName = (id: number) => exercises.value[id]?.name

  const stepValidation = computed(() => routineStepsSchema.safeParse(steps.value))
  const metaValidation = computed(() => routineMetaSchema.safeParse(content()))

  /** Client and server messages by step id, then by field within the step ('_' for the step as a whole). */
  const stepErrors = computed(() => {
    const errors: Record<string, FieldMessages> = {}
    const add = (path: (string | number)[], message: string) => {
      const place = tree.locatePath(steps.value, path)
      if (!place) return
      errors[place.stepId] ??= {}
      errors[place.stepId]![place.field] ??= message
    }
    for (const [key, message] of Object.entries(serverErrors.value)) add(key.split('.'), message)
    if (!stepValidation.value.success) {
      for (const issue of stepValidation.value.error.issues) add(['steps', ...issue.path as (string | number)[]], issue.message)
    }
    return errors
  })

  /** Messages about the routine itself: its title, category, description, and the step list as a whole. */
  const routineErrors = computed(() => {
    const errors: FieldMessages = {}
    for (const [key, message] of Object.entries(serverErrors.value)) {
      if (!key.startsWith('steps.') || !tree.locatePath(steps.value, key.split('.'))) errors[key] ??= message
    }
    if (!metaValidation.value.success) {
      for (const issue of metaValidation.value.error.issues) errors[issue.path.join('.') || '_'] ??= issue.message
    }
    if (!stepValidation.value.success) {
      for (const issue of stepValidation.value.error.issues) {
        if (!tree.locatePath(steps.value, ['steps', ...issue.path as (string | number)[]])) errors.steps ??= issue.message
      }
    }
    return errors
  })

  const valid = computed(() => stepValidation.value.success && metaValidation.value.success)
  const errorCount = computed(() => Object.values(stepErrors.value).reduce((sum, fields) => sum + Object.keys(fields).length, 0) + Object.keys(routineErrors.value).length)

  function applyServerErrors(fields: FieldMessages) {
    serverErrors.value = { ...fields }
  }

  /** Totals and segments as the shared timeline computes them; null while the tree cannot be timed. */
  const timeline = computed(() => {
    // A missing exercise or a bad note does not change the clock; a bad number or count does.
    if (!stepValidation.value.success && stepValidation.value.error.issues.some((issue) => {
      const field = [...issue.path].reverse().find(part => typeof part === 'string')
      return issue.path.length === 0 || (typeof field === 'string' && timingFields.has(field))
    })) return null
    try {
      return buildTimeline(steps.value)
    }
    catch {
      return null
    }
  })
  const totals = computed(() => timeline.value?.totals ?? null)

  function payload() {
    return tree.clone({ ...content(), ...(version.value ? { version: version.value } : {}) })
  }

  return {
    routineId,
    version,
    title,
    category,
    description,
    steps,
    exercises,
    dirty,
    canUndo,
    canRedo,
    stepErrors,
    routineErrors,
    valid,
    errorCount,
    timeline,
    totals,
    load,
    reset,
    markSaved,
    undo,
    redo,
    setMeta,
    addStep,
    addBlock,
    addSets,
    addRepeat,
    duplicateStep,
    updateStep,
    removeStep,
    moveUp,
    moveDown,
    indent,
    outdent,
    move,
    canMoveUp,
    canMoveDown,
    canIndent,
    canOutdent,
    placeOf,
    rememberExercise,
    exerciseName,
    applyServerErrors,
    payload,
  }
})
