// Calendar days as `YYYY-MM-DD` text. All arithmetic happens on UTC midnights, which have no
// daylight-saving jumps, so adding 7 days always lands on the same weekday and a month end never
// shifts a date. Time zones only matter when asking "what day is it now for this person".

export const DAY_MS = 86_400_000
export const MAX_PLAN_WEEKS = 26

/** 1 = Monday … 7 = Sunday (ISO 8601 weekday numbers). */
export const weekdayNames = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'] as const
export const weekdayShortNames = ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'] as const

const dayPattern = /^(\d{4})-(\d{2})-(\d{2})$/

/** True for a real calendar date written `YYYY-MM-DD` (2026-02-29 is not one, 2028-02-29 is). */
export function isCalendarDay(value: string): boolean {
  const match = dayPattern.exec(value)
  if (!match) return false
  const [, y, m, d] = match.map(Number) as [number, number, number, number]
  const date = new Date(Date.UTC(y, m - 1, d))
  return date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d
}

// Day arithmetic runs thousands of times per insights request over the same few hundred days:
// both directions are remembered (bounded, cleared when full).
const msOfDay = new Map<string, number>()
const dayOfMs = new Map<number, string>()
const REMEMBERED_DAYS = 20_000

function toUtcMs(day: string): number {
  const known = msOfDay.get(day)
  if (known !== undefined) return known
  if (!isCalendarDay(day)) throw new RangeError(`Not a calendar day: ${day}`)
  const [y, m, d] = day.split('-').map(Number) as [number, number, number]
  const ms = Date.UTC(y, m - 1, d)
  if (msOfDay.size >= REMEMBERED_DAYS) msOfDay.clear()
  msOfDay.set(day, ms)
  return ms
}

function fromUtcMs(ms: number): string {
  const known = dayOfMs.get(ms)
  if (known !== undefined) return known
  const day = new Date(ms).toISOString().slice(0, 10)
  if (dayOfMs.size >= REMEMBERED_DAYS) dayOfMs.clear()
  dayOfMs.set(ms, day)
  return day
}

export function addDays(day: string, days: number): string {
  return fromUtcMs(toUtcMs(day) + days * DAY_MS)
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return Math.round((toUtcMs(to) - toUtcMs(from)) / DAY_MS)
}

/** ISO weekday of a calendar day: 1 = Monday … 7 = Sunday. */
export function weekdayOf(day: string): number {
  const sundayFirst = new Date(toUtcMs(day)).getUTCDay()
  return sundayFirst === 0 ? 7 : sundayFirst
}

/** The Monday of the week holding `day`. */
export function startOfWeek(day: string): string {
  return addDays(day, 1 - weekdayOf(day))
}

export function startOfMonth(day: string): string {
  return `${day.slice(0, 7)}-01`
}

export function addMonths(day: string, months: number): string {
  const [y, m] = day.split('-').map(Number) as [number, number]
  const first = new Date(Date.UTC(y, m - 1 + months, 1))
  return fromUtcMs(first.getTime())
}

/** The days `from` … `to` inclusive. */
export function daysInRange(from: string, to: string): string[] {
  const count = daysBetween(from, to)
  return Array.from({ length: Math.max(0, count + 1) }, (_, index) => addDays(from, index))
}

/** Monday-first weeks covering the month of `day`, for a month grid (4 to 6 rows of 7 days). */
export function monthGrid(day: string): string[][] {
  const first = startOfMonth(day)
  const last = addDays(addMonths(first, 1), -1)
  const days = daysInRange(startOfWeek(first), addDays(startOfWeek(last), 6))
  return Array.from({ length: days.length / 7 }, (_, week) => days.slice(week * 7, week * 7 + 7))
}

export interface SeriesPattern {
  startDate: string
  weeks: number
  /** 1 = Monday … 7 = Sunday */
  weekdays: number[]
}

/**
 * Every day from `startDate` (inclusive) for `weeks` × 7 days that falls on one of `weekdays`, in order.
 * E.g. Tuesdays and Fridays for 10 weeks from a Monday gives 20 days.
 */
export function seriesDates({ startDate, weeks, weekdays }: SeriesPattern): string[] {
  const wanted = new Set(weekdays)
  return daysInRange(startDate, addDays(startDate, weeks * 7 - 1)).filter(day => wanted.has(weekdayOf(day)))
}

// Building a DateTimeFormat costs far more than using one; keep one per time zone.
const dayFormats = new Map<string, Intl.DateTimeFormat | null>()

/** Today's calendar day for someone in `timeZone` (an IANA name); unknown zones count as UTC. */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  if (!dayFormats.has(timeZone)) {
    try {
      dayFormats.set(timeZone, new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }))
    }
    catch {
      dayFormats.set(timeZone, null)
    }
  }
  return dayFormats.get(timeZone)?.format(now) ?? now.toISOString().slice(0, 10)
}

/** A midnight-UTC Date for a calendar day: what date-only formatters (Intl with timeZone UTC, iCalendar) expect. */
export function dayToUtcDate(day: string): Date {
  return new Date(toUtcMs(day))
}

const longFormat = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' })
const shortFormat = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', weekday: 'short', day: 'numeric', month: 'short' })

/** "Tue 3 Mar 2026" (or without the year), the same wherever it is read. */
export function formatDay(day: string, { year = true } = {}): string {
  return (year ? longFormat : shortFormat).format(dayToUtcDate(day)).replace(',', '')
}
