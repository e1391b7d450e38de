import type { BlockInput } from '#shared/schemas/block'
import type { LighterWeeks, ProgressionRule, Taper } from '#shared/utils/progression'

export interface BlockRoutineDraft {
  id?: number
  routineId: number | null
  weekday: number
  rules: ProgressionRule[]
  note: string
}

export interface BlockDraft {
  name: string
  startDate: string
  weeks: number
  athleteIds: number[]
  squadIds: number[]
  hasRace: boolean
  race: { name: string, date: string, distanceKm: number | null }
  hasLighter: boolean
  lighterMode: 'every' | 'chosen'
  lighterEvery: number
  lighterWeeks: string
  lighterPercent: number
  hasTaper: boolean
  taperWeeks: number
  taperPercent: number
  note: string
  routines: BlockRoutineDraft[]
}

export interface SavedBlock {
  name: string
  startDate: string
  weeks: number
  athleteIds: number[]
  squadIds: number[]
  goalRace: { name: string, date: string, distanceM: number } | null
  lighter: LighterWeeks | null
  taper: Taper | null
  note: string
  routines: { id: number, routineId: number, weekday: number, rules: ProgressionRule[], note: string }[]
}

/** The block form's state and its conversion to the API's input; server field names map back to the form. */
export function useBlockForm(initial?: SavedBlock, defaults: { startDate?: string } = {}) {
  const draft = reactive<BlockDraft>({
    name: initial?.name ?? '',
    startDate: initial?.startDate ?? defaults.startDate ?? '',
    weeks: initial?.weeks ?? 8,
    athleteIds: [...(initial?.athleteIds ?? [])],
    squadIds: [...(initial?.squadIds ?? [])],
    hasRace: Boolean(initial?.goalRace),
    race: { name: initial?.goalRace?.name ?? '', date: initial?.goalRace?.date ?? '', distanceKm: initial?.goalRace ? initial.goalRace.distanceM / 1000 : null },
    hasLighter: Boolean(initial?.lighter),
    lighterMode: initial?.lighter?.weeks?.length ? 'chosen' : 'every',
    lighterEvery: initial?.lighter?.every ?? 4,
    lighterWeeks: initial?.lighter?.weeks?.join(', ') ?? '',
    lighterPercent: Math.round((initial?.lighter?.factor ?? 0.7) * 100),
    hasTaper: Boolean(initial?.taper),
    taperWeeks: initial?.taper?.weeks ?? 1,
    taperPercent: Math.round((initial?.taper?.factor ?? 0.6) * 100),
    note: initial?.note ?? '',
    routines: (initial?.routines ?? []).map(slot => ({ id: slot.id, routineId: slot.routineId, weekday: slot.weekday, rules: slot.rules.map(rule => ({ ...rule })), note: slot.note })),
  })

  function addRoutine() {
    draft.routines.push({ routineId: null, weekday: 2, rules: [], note: '' })
  }
  function removeRoutine(index: number) {
    draft.routines.splice(index, 1)
  }
  function addRule(index: number, stepId: string, field: ProgressionRule['field']) {
    draft.routines[index]!.rules.push({ stepId, field, by: 1 })
  }
  function removeRule(index: number, ruleIndex: number) {
    draft.routines[index]!.rules.splice(ruleIndex, 1)
  }

  const input = computed((): BlockInput => ({
    name: draft.name,
    startDate: draft.startDate,
    weeks: Number(draft.weeks),
    athleteIds: draft.athleteIds,
    squadIds: draft.squadIds,
    goalRace: draft.hasRace ? { name: draft.race.name, date: draft.race.date, distanceM: Math.round(Number(draft.race.distanceKm ?? 0) * 1000) } : null,
    lighter: draft.hasLighter
      ? draft.lighterMode === 'every'
        ? { every: Number(draft.lighterEvery), factor: Number(draft.lighterPercent) / 100 }
        : { weeks: draft.lighterWeeks.split(/[\s,]+/).filter(Boolean).map(Number), factor: Number(draft.lighterPercent) / 100 }
      : null,
    taper: draft.hasTaper ? { weeks: Number(draft.taperWeeks), factor: Number(draft.taperPercent) / 100 } : null,
    note: draft.note,
    routines: draft.routines.map(slot => ({
      ...(slot.id ? { id: slot.id } : {}),
      routineId: slot.routineId ?? 0,
      weekday: Number(slot.weekday),
      note: slot.note,
      rules: slot.rules.map(rule => ({
        stepId: rule.stepId,
        field: rule.field,
        by: Number(rule.by),
        ...(rule.mode && rule.field === 'loadKg' ? { mode: rule.mode } : {}),
        ...(rule.every && Number(rule.every) > 1 ? { every: Number(rule.every) } : {}),
        ...(rule.cap !== undefined && rule.cap !== null && String(rule.cap) !== '' ? { cap: Number(rule.cap) } : {}),
      })),
    })),
  }))

  return { draft, input, addRoutine, removeRoutine, addRule, removeRule }
}

/** The server's field messages, or one line for the whole form. */
export function blockErrors(error: unknown) {
  const { fields, message } = readApiError(error, 'That did not work; try again')
  return { fields, message: Object.keys(fields).length ? 'Check the marked fields.' : message }
}

/**
 * One request at a time from a block screen: `busy` while it runs; on failure its field messages land in
 * `fields` (the form's `errors` unless told otherwise) and its summary in `formError`. Resolves true on success.
 */
export function useBlockRequests() {
  const busy = ref(false)
  const errors = ref<Record<string, string>>({})
  const formError = ref('')
  async function run(request: () => Promise<unknown>, fields = errors): Promise<boolean> {
    busy.value = true
    formError.value = ''
    try {
      await request()
      fields.value = {}
      return true
    }
    catch (error) {
      ({ fields: fields.value, message: formError.value } = blockErrors(error))
      return false
    }
    finally {
      busy.value = false
    }
  }
  return { busy, errors, formError, run }
}
