// What a coach or athlete sees for an assignment. The stored status is what happened (set by the
// session player); "overdue" is derived: still planned and its day has passed where the athlete lives.

export const shownStatuses = ['planned', 'done', 'partial', 'skipped', 'overdue'] as const
export type ShownStatus = typeof shownStatuses[number]

export const statusLabels: Record<ShownStatus, string> = {
  planned: 'Planned',
  done: 'Done',
  partial: 'Partly done',
  skipped: 'Skipped',
  overdue: 'Overdue',
}

export function shownStatus(status: string, date: string, athleteToday: string): ShownStatus {
  if (status === 'planned') return date < athleteToday ? 'overdue' : 'planned'
  return (shownStatuses as readonly string[]).includes(status) ? status as ShownStatus : 'planned'
}

export const routineCategoryLabels: Record<string, string> = {
  strength: 'Strength',
  hills: 'Hills',
  drills: 'Drills and strides',
  mixed: 'Mixed',
}
