import { describe, expect, it } from 'vitest'
import { blockProgressSeries, type ProgressRow } from '../../shared/utils/block-progress'
import { blockChangesLabel, blockWeekLabel } from '../../shared/utils/block-week'

// Plain sums and means; no training formula involved.
const rows: ProgressRow[] = [
  { athleteId: 1, athleteName: 'Ffion Aske', week: 1, plannedMin: 40, doneMin: 42, done: true },
  { athleteId: 1, athleteName: 'Ffion Aske', week: 2, plannedMin: 45, doneMin: 0, done: false },
  { athleteId: 2, athleteName: 'Oren Blythe', week: 1, plannedMin: 40, doneMin: 38, done: true },
  { athleteId: 2, athleteName: 'Oren Blythe', week: 2, plannedMin: 45, doneMin: 45, done: true },
  { athleteId: 3, athleteName: 'Cai Penhallow', week: 1, plannedMin: 30, doneMin: 30, done: true },
]

describe('blockProgressSeries', () => {
  const series = blockProgressSeries(rows, 3, [{ id: 7, name: 'Trail', athleteIds: [1, 2] }])

  it('adds up each athlete\'s weeks, including weeks with nothing planned', () => {
    const ffion = series.find(item => item.key === 'athlete-1')!
    expect(ffion.weeks).toEqual([
      { week: 1, plannedMin: 40, doneMin: 42, plannedSessions: 1, doneSessions: 1 },
      { week: 2, plannedMin: 45, doneMin: 0, plannedSessions: 1, doneSessions: 0 },
      { week: 3, plannedMin: 0, doneMin: 0, plannedSessions: 0, doneSessions: 0 },
    ])
  })

  it('gives squads and everyone the mean per athlete', () => {
    // Trail week 1: (40 + 40) / 2 = 40 planned, (42 + 38) / 2 = 40 done; week 2: 90 / 2 = 45, 45 / 2 = 22.5.
    const trail = series.find(item => item.key === 'squad-7')!
    expect(trail.weeks.slice(0, 2).map(week => [week.plannedMin, week.doneMin])).toEqual([[40, 40], [45, 22.5]])
    // Everyone week 1: (40 + 40 + 30) / 3 = 36.67 → 36.7 planned; (42 + 38 + 30) / 3 = 36.67 → 36.7 done.
    expect(series[0]).toMatchObject({ key: 'all', perAthlete: true })
    expect(series[0]!.weeks[0]).toMatchObject({ plannedMin: 36.7, doneMin: 36.7, plannedSessions: 3, doneSessions: 3 })
  })

  it('lists athletes by name after the squads', () => {
    expect(series.map(item => item.label)).toEqual(['Everyone', 'Trail (squad)', 'Cai Penhallow', 'Ffion Aske', 'Oren Blythe'])
  })
})

describe('block week wording', () => {
  it('names the week and what changed', () => {
    expect(blockWeekLabel({ week: 3, weeks: 8, kind: 'lighter' })).toBe('Week 3 of 8, lighter week')
    expect(blockWeekLabel({ week: 8, weeks: 8, kind: 'taper' })).toBe('Week 8 of 8, taper week')
    expect(blockChangesLabel({ week: 2, changes: ['+1 round'], overridden: false })).toBe('+1 round from last week')
    expect(blockChangesLabel({ week: 1, changes: [], overridden: false })).toBe('First week of the block')
    expect(blockChangesLabel({ week: 5, changes: [], overridden: true })).toBe('Same as last week (set by your coach)')
  })
})
