import type { SnapshotBlockWeek } from '../types/domain'

/** "Week 3 of 8, lighter week" — how the athlete's screens and feed name a block session's week. */
export function blockWeekLabel(block: Pick<SnapshotBlockWeek, 'week' | 'weeks' | 'kind'>): string {
  const kind = block.kind === 'lighter' ? ', lighter week' : block.kind === 'taper' ? ', taper week' : ''
  return `Week ${block.week} of ${block.weeks}${kind}`
}

/** "+1 round, +2.5 kg from last week", or nothing to say. */
export function blockChangesLabel(block: Pick<SnapshotBlockWeek, 'week' | 'changes' | 'overridden'>): string {
  if (block.week === 1) return 'First week of the block'
  const changes = block.changes.length ? `${block.changes.join(', ')} from last week` : 'Same as last week'
  return block.overridden ? `${changes} (set by your coach)` : changes
}

/** One line for the calendar feed and e-mails. */
export function blockWeekLine(block: SnapshotBlockWeek): string {
  return `${block.name}: ${blockWeekLabel(block).toLowerCase()}. ${blockChangesLabel(block)}.`
}
