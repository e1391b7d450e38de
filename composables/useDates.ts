import { formatDate, pickLocale, pickTimeZone, type DatePrefs, type DateStyle } from '#shared/utils/date-format'

const TIME_ZONE_COOKIE = 'switchback-tz'

/**
 * Dates in the reader's locale and time zone. The server picks both from the request (Accept-Language and
 * a cookie the browser set on an earlier visit) and hands them to the browser in the payload, so the
 * hydrated page matches; once mounted, the browser corrects the zone if it differs and remembers it.
 */
export function useDates() {
  const cookie = useCookie<string | null>(TIME_ZONE_COOKIE, { sameSite: 'lax', maxAge: 60 * 60 * 24 * 365 })
  const prefs = useState<DatePrefs>('date-prefs', () => ({
    locale: pickLocale(import.meta.server ? useRequestHeaders(['accept-language'])['accept-language'] : navigator.languages),
    timeZone: pickTimeZone(cookie.value),
  }))

  if (import.meta.client) {
    onMounted(() => {
      const zone = Intl.DateTimeFormat().resolvedOptions().timeZone
      if (zone && zone !== prefs.value.timeZone) {
        cookie.value = zone
        prefs.value = { ...prefs.value, timeZone: zone }
      }
    })
  }

  const format = (value: string | number | Date | null | undefined, style: DateStyle = 'day') => (value === null || value === undefined || value === '' ? '—' : formatDate(value, style, prefs.value))
  /** A calendar day in the reader's words, with or without the year (the same options as `formatDay`). */
  const day = (value: string, { year = true } = {}) => format(value, year ? 'day' : 'dayShort')
  return { prefs: readonly(prefs), format, day }
}
