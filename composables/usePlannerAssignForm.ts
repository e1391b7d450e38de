import { assignSchema } from '#shared/schemas/planner'
import { seriesDates } from '#shared/utils/dates'
import { fieldErrors } from '#shared/utils/errors'
import { plural } from '#shared/utils/vocabulary'
import type { PlannerOptions } from '~/composables/usePlanner'

export interface SkippedSession { athleteId: number, name: string, date: string }
interface BatchAnswer { created: number, athleteIds: number[], skipped: SkippedSession[], repeated: boolean }

function newBatchKey() {
  return `batch-${crypto.randomUUID()}`
}

/**
 * The planner's assign form: its fields, the checked request body, the preview of dates and sessions,
 * and sending it. Each intended batch carries one idempotency key, so a double click (or a retry after
 * a lost answer) cannot plan it twice; the form resets after a success. Sessions the athletes already
 * had are skipped by the server and listed in `skipped`, with `planSkippedAnyway` to confirm them.
 */
export function usePlannerAssignForm(options: () => PlannerOptions, today: () => string) {
  const routineId = ref<number | ''>('')
  const who = ref<'squad' | 'athletes'>('squad')
  const squadId = ref<number | ''>('')
  const athleteIds = ref<number[]>([])
  const when = ref<'series' | 'dates'>('series')
  const startDate = ref(today())
  const weeks = ref<number | ''>(8)
  const weekdays = ref<number[]>([])
  const dayToAdd = ref(today())
  const dates = ref<string[]>([])
  const note = ref('')
  const athleteNotes = ref<Record<string, string>>({})

  const errors = ref<Record<string, string>>({})
  const formError = ref('')
  const pending = ref(false)
  const skipped = ref<SkippedSession[]>([])
  const skippedRoutine = ref<{ id: number, title: string } | null>(null)
  let batchKey = newBatchKey()

  const routine = computed(() => options().routines.find(item => item.id === routineId.value))
  const batchAthletes = computed(() => who.value === 'squad'
    ? options().athletes.filter(athlete => squadId.value !== '' && athlete.squadIds.includes(squadId.value))
    : options().athletes.filter(athlete => athleteIds.value.includes(athlete.id)))

  const body = computed(() => ({
    routineId: routineId.value === '' ? undefined : routineId.value,
    ...(who.value === 'squad' ? { squadId: squadId.value === '' ? undefined : squadId.value } : { athleteIds: athleteIds.value }),
    ...(when.value === 'series'
      ? { series: { startDate: startDate.value, weeks: weeks.value === '' ? undefined : Number(weeks.value), weekdays: weekdays.value } }
      : { dates: dates.value }),
    note: note.value,
    athleteNotes: Object.fromEntries(Object.entries(athleteNotes.value).filter(([id, text]) => text.trim() && batchAthletes.value.some(athlete => String(athlete.id) === id))),
  }))

  const check = computed(() => assignSchema.safeParse(body.value))
  const preview = computed(() => {
    if (when.value === 'dates') return [...new Set(dates.value)].sort()
    const parsed = check.value.success ? check.value.data.series : undefined
    return parsed ? seriesDates(parsed) : []
  })
  const sessions = computed(() => preview.value.length * batchAthletes.value.length)

  // Any change to the form makes it a different batch, with a key of its own.
  watch(body, () => {
    batchKey = newBatchKey()
  }, { deep: true })

  function addDay() {
    if (dayToAdd.value && !dates.value.includes(dayToAdd.value)) dates.value = [...dates.value, dayToAdd.value].sort()
  }
  function removeDay(day: string) {
    dates.value = dates.value.filter(item => item !== day)
  }

  function reset() {
    routineId.value = ''
    who.value = 'squad'
    squadId.value = ''
    athleteIds.value = []
    when.value = 'series'
    startDate.value = today()
    weeks.value = 8
    weekdays.value = []
    dayToAdd.value = today()
    dates.value = []
    note.value = ''
    athleteNotes.value = {}
    errors.value = {}
    formError.value = ''
  }

  function showError(error: unknown) {
    const refused = readApiError(error, 'Could not plan that; try again')
    errors.value = refused.fields
    formError.value = Object.keys(errors.value).length ? 'Check the marked fields.' : refused.message
  }

  /** Sends the batch; resolves to a summary line for the page, or null when nothing was sent or it failed. */
  async function submit(): Promise<string | null> {
    if (pending.value) return null
    formError.value = ''
    errors.value = check.value.success ? {} : fieldErrors(check.value.error)
    if (!check.value.success) return null
    pending.value = true
    try {
      const title = routine.value?.title ?? 'the routine'
      const result = await $fetch<BatchAnswer>('/api/assignments', { method: 'POST', body: { ...body.value, idempotencyKey: batchKey } })
      skipped.value = result.skipped
      skippedRoutine.value = result.skipped.length && routine.value ? { id: routine.value.id, title: routine.value.title } : null
      reset()
      batchKey = newBatchKey()
      return `Planned ${plural(result.created, 'session')} of ${title} for ${plural(result.athleteIds.length, 'athlete')}.`
        + (result.skipped.length ? ` ${plural(result.skipped.length, 'session')} already on the plan ${result.skipped.length === 1 ? 'was' : 'were'} skipped.` : '')
    }
    catch (error) {
      showError(error)
      return null
    }
    finally {
      pending.value = false
    }
  }

  /** Plans the skipped sessions after all (the coach confirmed they want the routine twice on those days). */
  async function planSkippedAnyway(): Promise<string | null> {
    const target = skippedRoutine.value
    if (!target || !skipped.value.length || pending.value) return null
    pending.value = true
    try {
      const byAthlete = new Map<number, string[]>()
      for (const item of skipped.value) byAthlete.set(item.athleteId, [...(byAthlete.get(item.athleteId) ?? []), item.date])
      let created = 0
      for (const [athleteId, days] of byAthlete) {
        const result = await $fetch<BatchAnswer>('/api/assignments', {
          method: 'POST',
          body: { routineId: target.id, athleteIds: [athleteId], dates: days, confirmDuplicates: true, idempotencyKey: newBatchKey() },
        })
        created += result.created
      }
      skipped.value = []
      skippedRoutine.value = null
      return `Planned ${plural(created, 'more session')} of ${target.title}.`
    }
    catch (error) {
      showError(error)
      return null
    }
    finally {
      pending.value = false
    }
  }

  function keepSkipped() {
    skipped.value = []
    skippedRoutine.value = null
  }

  return {
    routineId, who, squadId, athleteIds, when, startDate, weeks, weekdays, dayToAdd, dates, note, athleteNotes,
    errors: readonly(errors), formError: readonly(formError), pending: readonly(pending),
    skipped: readonly(skipped), routine, batchAthletes, preview, sessions,
    addDay, removeDay, reset, submit, planSkippedAnyway, keepSkipped,
  }
}
