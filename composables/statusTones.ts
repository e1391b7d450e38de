import type { ShownStatus } from '#shared/utils/vocabulary'

/** Our own tones for the states of a planned session: the planner's badge and the athlete report's calendar share them. */
export const statusTones: Record<ShownStatus, string> = {
  planned: 'border-granite-300 bg-white text-granite-700',
  done: 'border-pine-300 bg-pine-50 text-pine-800',
  partial: 'border-ridge-300 bg-ridge-50 text-ridge-800',
  skipped: 'border-granite-300 bg-granite-100 text-granite-600 line-through decoration-granite-400',
  overdue: 'border-clay-300 bg-clay-50 text-clay-800',
}
