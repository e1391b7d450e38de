import type { ShownStatus } from '#shared/utils/vocabulary'

export interface PlannedAssignment {
  id: number
  date: string
  athleteId: number
  athleteName: string
  routineId: number
  routineVersion: number
  latestVersion: number
  title: string
  category: string
  seriesId: number | null
  seriesSquadId: number | null
  note: string
  status: string
  shownStatus: ShownStatus
}

export interface PlannerOptions {
  routines: { id: number, title: string, category: string, version: number }[]
  athletes: { id: number, name: string, squadIds: number[] }[]
  squads: { id: number, name: string }[]
}

/** The message a coach should read for a failed planner call. */
export function plannerErrorMessage(error: unknown) {
  return apiErrorMessage(error)
}

/** The planner's changes to existing assignments, each answering with a message to show. */
export function usePlannerActions(refresh: () => Promise<unknown>) {
  const { day: formatDay } = useDates()
  const message = ref('')
  const error = ref('')
  const busy = ref(false)

  async function run(action: () => Promise<string>) {
    busy.value = true
    error.value = ''
    message.value = ''
    try {
      message.value = await action()
      await refresh()
    }
    catch (failure) {
      error.value = plannerErrorMessage(failure)
    }
    finally {
      busy.value = false
    }
  }

  const move = (assignment: PlannedAssignment, date: string) => run(async () => {
    await $fetch(`/api/assignments/${assignment.id}`, { method: 'PATCH', body: { date } })
    return `Moved ${assignment.athleteName}'s ${assignment.title} to ${formatDay(date)}.`
  })
  /** The grid's move: to another day and/or another athlete of the team. */
  const moveTo = (assignment: PlannedAssignment, to: { date: string, athleteId: number }, athleteName?: string) => run(async () => {
    await $fetch(`/api/assignments/${assignment.id}`, { method: 'PATCH', body: to })
    const who = to.athleteId === assignment.athleteId ? assignment.athleteName : (athleteName ?? 'another athlete')
    return `Moved ${assignment.title} to ${who} on ${formatDay(to.date)}.`
  })
  const saveNote = (assignment: PlannedAssignment, note: string) => run(async () => {
    await $fetch(`/api/assignments/${assignment.id}`, { method: 'PATCH', body: { note } })
    return 'Note saved.'
  })
  const remove = (assignment: PlannedAssignment) => run(async () => {
    await $fetch(`/api/assignments/${assignment.id}`, { method: 'DELETE' })
    return `Removed ${assignment.title} on ${formatDay(assignment.date)} for ${assignment.athleteName}.`
  })
  const removeRest = (assignment: PlannedAssignment, who: 'athlete' | 'all') => run(async () => {
    const result = await $fetch<{ removed: number }>(`/api/assignments/${assignment.id}/rest-of-series`, { method: 'DELETE', query: { who } })
    return `Removed ${result.removed} session${result.removed === 1 ? '' : 's'} from the series.`
  })
  const syncSquad = (assignment: PlannedAssignment) => run(async () => {
    const result = await $fetch<{ added: number, created: number }>(`/api/assignments/series/${assignment.seriesId}/sync-squad`, { method: 'POST' })
    return result.added ? `Added ${result.added} athlete${result.added === 1 ? '' : 's'} (${result.created} sessions) to the rest of the series.` : 'Everyone in the squad is already in this series.'
  })
  const refreshRoutine = (assignment: PlannedAssignment) => run(async () => {
    const result = await $fetch<{ updated: number, version: number }>('/api/assignments/refresh-routine', { method: 'POST', body: { routineId: assignment.routineId } })
    return `Updated ${result.updated} upcoming session${result.updated === 1 ? '' : 's'} to version ${result.version} of the routine.`
  })

  return { message, error, busy: readonly(busy), move, moveTo, saveNote, remove, removeRest, syncSquad, refreshRoutine }
}
