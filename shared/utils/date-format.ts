// One way to write dates, given the reader's locale and time zone explicitly: the server and the browser
// are handed the same two values, so the page they each render reads the same.

export interface DatePrefs {
  /** A BCP 47 tag the runtime supports, e.g. "en-GB". */
  locale: string
  /** An IANA time zone, e.g. "Europe/London". */
  timeZone: string
}

/**
 * day: "Tue, 3 Mar 2026" · dayShort: "Tue, 3 Mar" · date: "3 Mar 2026" · dateShort: "3 Mar" ·
 * month: "March 2026" · moment: "3 Mar 2026, 14:05" (each in the locale's own order and words).
 */
export type DateStyle = 'day' | 'dayShort' | 'date' | 'dateShort' | 'month' | 'moment'

const styles: Record<DateStyle, Intl.DateTimeFormatOptions> = {
  day: { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' },
  dayShort: { weekday: 'short', day: 'numeric', month: 'short' },
  date: { day: 'numeric', month: 'short', year: 'numeric' },
  dateShort: { day: 'numeric', month: 'short' },
  month: { month: 'long', year: 'numeric' },
  moment: { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' },
}

export const defaultDatePrefs: DatePrefs = { locale: 'en-GB', timeZone: 'UTC' }

const formats = new Map<string, Intl.DateTimeFormat>()
function formatter(style: DateStyle, locale: string, timeZone: string) {
  const key = `${style}|${locale}|${timeZone}`
  let format = formats.get(key)
  if (!format) {
    format = new Intl.DateTimeFormat(locale, { ...styles[style], timeZone })
    formats.set(key, format)
  }
  return format
}

const calendarDay = /^\d{4}-\d{2}-\d{2}$/

/**
 * A calendar day ("2026-03-03") is written as that day wherever the reader is; an instant (a Date, epoch
 * milliseconds or an ISO timestamp) is written as the day and time it was in the reader's time zone.
 */
export function formatDate(value: string | number | Date, style: DateStyle, prefs: DatePrefs = defaultDatePrefs): string {
  const isDay = typeof value === 'string' && calendarDay.test(value)
  const date = isDay ? new Date(`${value}T00:00:00Z`) : new Date(value)
  if (Number.isNaN(date.getTime())) return String(value)
  return formatter(style, prefs.locale, isDay ? 'UTC' : prefs.timeZone).format(date)
}

/** The first tag of an Accept-Language header (or a browser's language) that this runtime supports. */
export function pickLocale(candidates: string | readonly string[] | null | undefined, fallback = defaultDatePrefs.locale): string {
  const tags = typeof candidates === 'string'
    ? candidates.split(',').map(part => part.split(';')[0]!.trim()).filter(Boolean)
    : [...(candidates ?? [])]
  for (const tag of tags) {
    try {
      const [supported] = Intl.DateTimeFormat.supportedLocalesOf(tag)
      if (supported) return supported
    }
    catch {
      // not a well-formed tag: try the next
    }
  }
  return fallback
}

/** The zone itself when the runtime knows it, otherwise the fallback. */
export function pickTimeZone(candidate: string | null | undefined, fallback = defaultDatePrefs.timeZone): string {
  if (!candidate) return fallback
  try {
    return new Intl.DateTimeFormat('en', { timeZone: candidate }).resolvedOptions().timeZone
  }
  catch {
    return fallback
  }
}
