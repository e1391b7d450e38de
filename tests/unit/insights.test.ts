import { describe, expect, it } from 'vitest'
import { addDays, daysBetween, startOfWeek, todayIn } from '../../shared/utils/dates'
import {
  compliance, dailySeries, ratioBand, ratiosOn, roundKg, roundLoad, roundRatio, weeklyLoads,
} from '../../shared/utils/insights'
import { complianceOver, sortTeamRows, type TeamInsightsRow } from '../../server/utils/insights'

describe('calendar days', () => {
  it('finds the Monday that starts an ISO week', () => {
    // ISO 8601 weeks start on Monday; 2026-03-15 is a Sunday, 2026-03-16 a Monday (calendar fact).
    expect(startOfWeek('2026-03-15')).toBe('2026-03-09')
    expect(startOfWeek('2026-03-16')).toBe('2026-03-16')
    expect(startOfWeek('2026-03-18')).toBe('2026-03-16')
    // Across a year end: 2027-01-01 is a Friday, its week starts Monday 2026-12-28.
    expect(startOfWeek('2027-01-01')).toBe('2026-12-28')
  })

  it('adds days and counts them across month and leap-day boundaries', () => {
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29')
    expect(addDays('2028-03-01', -1)).toBe('2028-02-29')
    expect(daysBetween('2026-01-01', '2026-12-31')).toBe(364)
    expect(() => addDays('not a day', 1)).toThrow(RangeError)
  })

  it('reads today in the athlete\'s time zone', () => {
    const instant = new Date('2026-03-15T23:30:00Z')
    expect(todayIn('UTC', instant)).toBe('2026-03-15')
    expect(todayIn('Pacific/Auckland', instant)).toBe('2026-03-16')
    expect(todayIn('America/Los_Angeles', instant)).toBe('2026-03-15')
    expect(todayIn('Not/AZone', instant)).toBe('2026-03-15')
  })
})

describe('daily series from SQL rows', () => {
  it('fills days without sessions with 0 and adds rows of the same day', () => {
    const rows = [{ day: '2026-03-03', load: 300 }, { day: '2026-03-01', load: 200 }, { day: '2026-03-03', load: 50 }, { day: '2026-02-27', load: 999 }]
    expect(dailySeries(rows, '2026-03-01', '2026-03-04')).toEqual([200, 0, 350, 0])
    expect(dailySeries(rows, '2026-03-04', '2026-03-01')).toEqual([])
  })
})

describe('compliance', () => {
  it('is done over assigned in whole percent, null when nothing was assigned', () => {
    // Common practice, no published source: compliance = sessions done / sessions assigned.
    expect(compliance(3, 4)).toEqual({ done: 3, assigned: 4, percent: 75 })
    expect(compliance(2, 3).percent).toBe(67)
    expect(compliance(0, 0).percent).toBeNull()
  })

  it('counts only assignments dated up to today within the window', () => {
    const counts = [
      { date: '2026-03-16', assigned: 1, done: 1 }, // 7 days before today: outside the 7-day window
      { date: '2026-03-17', assigned: 1, done: 0 },
      { date: '2026-03-20', assigned: 2, done: 2 },
      { date: '2026-03-23', assigned: 1, done: 1 }, // today
      { date: '2026-03-24', assigned: 1, done: 0 }, // tomorrow: not counted yet
      { date: '2026-02-23', assigned: 1, done: 1 }, // 28 days before today: outside the 28-day window
    ]
    expect(complianceOver(counts, '2026-03-23', 7)).toEqual({ done: 3, assigned: 4, percent: 75 })
    expect(complianceOver(counts, '2026-03-23', 28)).toEqual({ done: 4, assigned: 5, percent: 80 })
  })
})

describe('weekly load bucketing', () => {
  it('totals Monday-start weeks and stops at today', () => {
    const rows = [
      { day: '2026-03-08', load: 100, sessions: 1 }, // Sunday: belongs to the week of 2 March
      { day: '2026-03-09', load: 200, sessions: 1 }, // Monday: starts a new week
      { day: '2026-03-15', load: 50, sessions: 2 },
      { day: '2026-03-17', load: 400, sessions: 1 },
    ]
    const weeks = weeklyLoads(rows, '2026-03-08', '2026-03-04', '2026-03-18')
    expect(weeks.map(week => [week.weekStart, week.load, week.sessions])).toEqual([
      ['2026-03-02', 100, 1],
      ['2026-03-09', 250, 3],
      ['2026-03-16', 400, 1],
    ])
  })
})

describe('acute:chronic ratio on a known series', () => {
  // 28 days at 100 a day, then 7 days at 200 a day, today is the 35th day.
  const first = '2026-01-05'
  const today = addDays(first, 34)
  const rows = Array.from({ length: 35 }, (_, index) => ({ day: addDays(first, index), load: index < 28 ? 100 : 200 }))

  it('gives the rolling ratio of the last 7 to the last 28 days', () => {
    // Hulin et al. (2014) rolling means: acute mean 200; chronic mean (21·100 + 7·200)/28 = 125 → 1.6.
    expect(ratiosOn(rows, first, today).acwrRolling).toBe(1.6)
  })

  it('gives the exponentially weighted ratio', () => {
    // Williams et al. (2017) EWMA, λa = 2/8, λc = 2/29, both seeded with the first day's 100. After 7 days at
    // 200: acute = 200 − 100·0.75^7 = 186.65, chronic = 200 − 100·(27/29)^7 = 139.38 → 1.339 (worked by hand).
    expect(ratiosOn(rows, first, today).acwrEwma).toBe(1.34)
  })

  it('reads 1 for a steady load and null before 28 days of history', () => {
    const steady = Array.from({ length: 40 }, (_, index) => ({ day: addDays(first, index), load: 300 }))
    // Any steady load gives equal acute and chronic averages (definition of both ratios).
    expect(ratiosOn(steady, first, addDays(first, 39))).toEqual({ acwrRolling: 1, acwrEwma: 1 })
    expect(ratiosOn(steady, first, addDays(first, 26))).toEqual({ acwrRolling: null, acwrEwma: null })
    expect(ratiosOn(steady, null, addDays(first, 39))).toEqual({ acwrRolling: null, acwrEwma: null })
  })

  it('treats days without a session as zero load once history has started', () => {
    // 28 days: 100 on each of the first 21, then nothing for a week → acute 0, chronic 75 → 0.
    const rest = Array.from({ length: 21 }, (_, index) => ({ day: addDays(first, index), load: 100 }))
    expect(ratiosOn(rest, first, addDays(first, 27)).acwrRolling).toBe(0)
  })

  it('bands the ratio against the commonly cited 0.8–1.3 guide', () => {
    // Gabbett (2016) describes 0.8–1.3 as the commonly cited range; the ends count as within.
    expect(ratioBand(0.79)).toBe('low')
    expect(ratioBand(0.8)).toBe('within')
    expect(ratioBand(1.3)).toBe('within')
    expect(ratioBand(1.31)).toBe('high')
    expect(ratioBand(null)).toBeNull()
  })
})

describe('rounding shared by screen and export', () => {
  it('rounds loads to whole units, ratios to 2 decimals and kilograms to 1', () => {
    expect(roundLoad(349.5)).toBe(350)
    expect(roundRatio(1.3389)).toBe(1.34)
    expect(roundRatio(null)).toBeNull()
    expect(roundKg(93.3333)).toBe(93.3)
  })
})

describe('team table sorting', () => {
  const row = (name: string, weekLoad: number, acwrEwma: number | null): TeamInsightsRow => ({
    athleteId: name.length, name, squads: [], today: '2026-03-23',
    compliance7: compliance(0, 0), compliance28: compliance(0, 0), lastSession: null,
    weekLoad, acwrRolling: null, acwrEwma, openPainFlags: 0,
  })
  const rows = [row('Cai', 300, 1.1), row('Ffion', 500, null), row('Tamsin', 100, 1.5)]

  it('sorts up and down with missing values last either way', () => {
    expect(sortTeamRows(rows, 'weekLoad').map(r => r.name)).toEqual(['Tamsin', 'Cai', 'Ffion'])
    expect(sortTeamRows(rows, '-weekLoad').map(r => r.name)).toEqual(['Ffion', 'Cai', 'Tamsin'])
    expect(sortTeamRows(rows, 'acwrEwma').map(r => r.name)).toEqual(['Cai', 'Tamsin', 'Ffion'])
    expect(sortTeamRows(rows, '-acwrEwma').map(r => r.name)).toEqual(['Tamsin', 'Cai', 'Ffion'])
    expect(sortTeamRows(rows, '-name').map(r => r.name)).toEqual(['Tamsin', 'Ffion', 'Cai'])
  })
})
