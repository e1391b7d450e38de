import { afterEach, describe, expect, it } from 'vitest'
import { addDays, daysBetween, formatDay, isCalendarDay, monthGrid, seriesDates, startOfWeek, todayIn, weekdayOf } from '../../shared/utils/dates'

// Expected weekdays and dates read off the Gregorian calendar; DST change dates are the
// 2026 rules of the UK (last Sunday of March/October) and the US (second Sunday of March, first of November).

const originalTz = process.env.TZ
afterEach(() => {
  process.env.TZ = originalTz
})

describe('calendar days', () => {
  it('accepts real dates only, including leap days', () => {
    expect(isCalendarDay('2028-02-29')).toBe(true)
    expect(isCalendarDay('2026-02-29')).toBe(false)
    expect(isCalendarDay('2026-04-31')).toBe(false)
    expect(isCalendarDay('2026-13-01')).toBe(false)
    expect(isCalendarDay('2026-1-5')).toBe(false)
    expect(isCalendarDay('not a date')).toBe(false)
  })

  it('adds days across month and year ends', () => {
    expect(addDays('2026-01-31', 1)).toBe('2026-02-01')
    expect(addDays('2026-02-28', 1)).toBe('2026-03-01')
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29')
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01')
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28')
    expect(daysBetween('2026-03-28', '2026-03-30')).toBe(2)
  })

  it('numbers weekdays Monday = 1 … Sunday = 7', () => {
    expect(weekdayOf('2026-03-02')).toBe(1)
    expect(weekdayOf('2026-03-29')).toBe(7)
    expect(weekdayOf('2028-02-29')).toBe(2)
    expect(startOfWeek('2026-03-29')).toBe('2026-03-23')
    expect(startOfWeek('2026-03-23')).toBe('2026-03-23')
  })

  it('builds Monday-first month grids', () => {
    const grid = monthGrid('2026-03-15')
    expect(grid[0]![0]).toBe('2026-02-23')
    expect(grid.at(-1)!.at(-1)).toBe('2026-04-05')
    expect(grid.every(week => week.length === 7 && weekdayOf(week[0]!) === 1)).toBe(true)
  })

  it('formats a day the same in any process time zone', () => {
    process.env.TZ = 'America/New_York'
    expect(formatDay('2026-03-08')).toBe('Sun 8 Mar 2026')
    process.env.TZ = 'Pacific/Kiritimati'
    expect(formatDay('2026-03-08', { year: false })).toBe('Sun 8 Mar')
  })
})

describe('seriesDates', () => {
  it('gives Tuesdays and Fridays for 10 weeks: 20 dates, all on those weekdays', () => {
    const dates = seriesDates({ startDate: '2026-03-02', weeks: 10, weekdays: [2, 5] })
    expect(dates).toHaveLength(20)
    expect(dates[0]).toBe('2026-03-03')
    expect(dates.at(-1)).toBe('2026-05-08')
    expect(new Set(dates.map(weekdayOf))).toEqual(new Set([2, 5]))
    expect([...dates].sort()).toEqual(dates)
  })

  it('crosses a month end and the UK spring change without shifting a day', () => {
    for (const tz of ['UTC', 'Europe/London', 'America/New_York']) {
      process.env.TZ = tz
      expect(seriesDates({ startDate: '2026-03-23', weeks: 2, weekdays: [2, 5, 7] }))
        .toEqual(['2026-03-24', '2026-03-27', '2026-03-29', '2026-03-31', '2026-04-03', '2026-04-05'])
    }
  })

  it('crosses the autumn changes in London (25 Oct) and New York (1 Nov)', () => {
    for (const tz of ['Europe/London', 'America/New_York']) {
      process.env.TZ = tz
      expect(seriesDates({ startDate: '2026-10-19', weeks: 2, weekdays: [1, 7] }))
        .toEqual(['2026-10-19', '2026-10-25', '2026-10-26', '2026-11-01'])
    }
  })

  it('handles the US spring change (8 Mar) and a leap day', () => {
    process.env.TZ = 'America/New_York'
    expect(seriesDates({ startDate: '2026-03-06', weeks: 1, weekdays: [6, 7, 1] })).toEqual(['2026-03-07', '2026-03-08', '2026-03-09'])
    expect(seriesDates({ startDate: '2028-02-28', weeks: 2, weekdays: [2] })).toEqual(['2028-02-29', '2028-03-07'])
  })

  it('starts counting on the start date itself, mid-week', () => {
    // Thursday start, Mondays and Thursdays, 2 weeks: Thu, Mon, Thu, Mon.
    expect(seriesDates({ startDate: '2026-01-29', weeks: 2, weekdays: [4, 1] })).toEqual(['2026-01-29', '2026-02-02', '2026-02-05', '2026-02-09'])
  })

  it('gives nothing for no weekdays', () => {
    expect(seriesDates({ startDate: '2026-01-29', weeks: 4, weekdays: [] })).toEqual([])
  })
})

describe('todayIn', () => {
  it('follows London across the spring and autumn changes', () => {
    expect(todayIn('Europe/London', new Date('2026-03-28T23:30:00Z'))).toBe('2026-03-28')
    expect(todayIn('Europe/London', new Date('2026-03-29T23:30:00Z'))).toBe('2026-03-30')
    expect(todayIn('Europe/London', new Date('2026-10-24T23:30:00Z'))).toBe('2026-10-25')
    expect(todayIn('Europe/London', new Date('2026-10-25T23:30:00Z'))).toBe('2026-10-25')
  })

  it('follows New York across the autumn change', () => {
    expect(todayIn('America/New_York', new Date('2026-11-01T04:30:00Z'))).toBe('2026-11-01')
    expect(todayIn('America/New_York', new Date('2026-11-02T04:30:00Z'))).toBe('2026-11-01')
    expect(todayIn('America/New_York', new Date('2026-03-08T04:30:00Z'))).toBe('2026-03-07')
  })

  it('treats an unknown zone as UTC', () => {
    expect(todayIn('Not/AZone', new Date('2026-05-01T23:59:00Z'))).toBe('2026-05-01')
  })
})
