import { addDays, daysBetween, startOfWeek } from './dates'
import { acwrEwma, acwrRolling, weeklyTotals } from './load'

// Aggregation for insights. Formulas live in load.ts / strength.ts; this file only arranges SQL-aggregated
// rows (one per athlete and day) into the dense daily series those formulas expect, and rounds for display.
// Dates are calendar days `YYYY-MM-DD` in the athlete's own time zone (session_logs.day is stored that way).

/** The commonly cited acute:chronic band. A guide for a conversation, not a rule (see docs/insights.md). */
export const RATIO_BAND = { low: 0.8, high: 1.3 } as const

export const ACUTE_DAYS = 7
export const CHRONIC_DAYS = 28
/** How many days before the day in question feed the ratio (the EWMA's seed fades to < 0.3 % over 84 days). */
export const RATIO_LOOKBACK_DAYS = 84

export type RatioBand = 'low' | 'within' | 'high'

export interface DailyLoad {
  day: string
  load: number
}

export interface Compliance {
  done: number
  assigned: number
  /** Whole percent, null when nothing was assigned. */
  percent: number | null
}

export interface WeekLoad {
  /** The Monday that starts the week. */
  weekStart: string
  load: number
  sessions: number
  acwrRolling: number | null
  acwrEwma: number | null
}

/** One load per day from `from` to `to` inclusive, 0 on days without a session; rows may be sparse and unordered. */
export function dailySeries(rows: readonly DailyLoad[], from: string, to: string): number[] {
  const length = daysBetween(from, to) + 1
  if (length <= 0) return []
  const series = Array.from({ length }, () => 0)
  for (const row of rows) {
    const index = daysBetween(from, row.day)
    if (index >= 0 && index < length) series[index]! += row.load
  }
  return series
}

export function compliance(done: number, assigned: number): Compliance {
  return { done, assigned, percent: assigned > 0 ? Math.round(done / assigned * 100) : null }
}

/**
 * Both acute:chronic ratios on `day`, from the daily loads of up to RATIO_LOOKBACK_DAYS days ending on it,
 * but never before the athlete's first session (days before anyone trained are not "rest").
 * Null until there are CHRONIC_DAYS days of history.
 */
export function ratiosOn(rows: readonly DailyLoad[], firstDay: string | null, day: string) {
  if (!firstDay || daysBetween(firstDay, day) < 0) return { acwrRolling: null, acwrEwma: null }
  const lookbackStart = addDays(day, -(RATIO_LOOKBACK_DAYS - 1))
  const from = daysBetween(firstDay, lookbackStart) > 0 ? lookbackStart : firstDay
  const series = dailySeries(rows, from, day)
  return {
    acwrRolling: roundRatio(acwrRolling(series, ACUTE_DAYS, CHRONIC_DAYS)),
    acwrEwma: roundRatio(acwrEwma(series, ACUTE_DAYS, CHRONIC_DAYS)),
  }
}

/**
 * Monday-start weeks from the week holding `from` to the week holding `today`: each week's load total
 * (via weeklyTotals over a series that starts on a Monday) and the ratios at the week's last day,
 * or at `today` for the current week.
 */
export function weeklyLoads(rows: readonly (DailyLoad & { sessions?: number })[], firstDay: string | null, from: string, today: string): WeekLoad[] {
  const start = startOfWeek(from)
  const end = addDays(startOfWeek(today), 6)
  const totals = weeklyTotals(dailySeries(rows, start, end), 7)
  const sessions = dailySeries(rows.map(row => ({ day: row.day, load: row.sessions ?? 0 })), start, end)
  return totals.map((total, index) => {
    const weekStart = addDays(start, index * 7)
    const lastDay = addDays(weekStart, 6)
    const asOf = daysBetween(lastDay, today) >= 0 ? lastDay : today
    return {
      weekStart,
      load: roundLoad(total),
      sessions: sessions.slice(index * 7, index * 7 + 7).reduce((count, value) => count + value, 0),
      ...ratiosOn(rows, firstDay, asOf),
    }
  })
}

export function ratioBand(ratio: number | null): RatioBand | null {
  if (ratio === null) return null
  if (ratio < RATIO_BAND.low) return 'low'
  if (ratio > RATIO_BAND.high) return 'high'
  return 'within'
}

// Rounding shared by the JSON routes, the pages and the CSV export, so the numbers match everywhere.

/** Loads in whole arbitrary units (RPE × minutes). */
export function roundLoad(load: number): number {
  return Math.round(load)
}

export function roundRatio(ratio: number | null): number | null {
  return ratio === null ? null : Math.round(ratio * 100) / 100
}

/** Kilograms to one decimal (estimated 1RM); volume loads in whole kilograms. */
export function roundKg(kg: number): number {
  return Math.round(kg * 10) / 10
}

export function roundVolume(kg: number): number {
  return Math.round(kg)
}

export function formatRatio(ratio: number | null): string {
  return ratio === null ? '—' : ratio.toFixed(2)
}
