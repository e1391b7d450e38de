// What a coach or athlete sees for an assignment. The stored status is what happened (set by the
// session player); "overdue" is derived: still planned and its day has passed where the athlete lives.

import { shownStatuses, type ShownStatus } from './vocabulary'

export function shownStatus(status: string, date: string, athleteToday: string): ShownStatus {
  if (status === 'planned') return date < athleteToday ? 'overdue' : 'planned'
  return (shownStatuses.values as readonly string[]).includes(status) ? status as ShownStatus : 'planned'
}
