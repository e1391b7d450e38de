import { formatDate, pickLocale, pickTimeZone, type DatePrefs, type DateStyle } from '#shared/utils/date-format'

const TIME_ZONE_COOKIE = 'switchback-tz'

// Read and written by hand rather than with useCookie, whose cookie library would join every page's first load.
function readZoneCookie(header: string | undefined) {
  const value = header?.split(/;\s*/).find(part => part.startsWith(`${TIME_ZONE_COOKIE}=`))?.slice(TIME_ZONE_COOKIE.length + 1)
  if (!value) return null
  try {
    return decodeURIComponent(value)
  }
  catch {
    return null
  }
}

/**
 * Dates in the reader's locale and time zone. The server picks both from the request (Accept-Language and
 * a cookie the browser set on an earlier visit) and hands them to the browser in the payload, so the
 * hydrated page matches; once mounted, the browser corrects the zone if it differs and remembers it.
 */
export function useDates() {
  const prefs = useState<DatePrefs>('date-prefs', () => ({
    locale: pickLocale(import.meta.server ? useRequestHeaders(['accept-language'])['accept-language'] : navigator.languages),
    timeZone: pickTimeZone(readZoneCookie(import.meta.server ? useRequestHeaders(['cookie']).cookie : document.cookie)),
  }))

  if (import.meta.client) {
    onMounted(() => {
      const zone = Intl.DateTimeFormat().resolvedOptions().timeZone
      if (zone && zone !== prefs.value.timeZone) {
        document.cookie = `${TIME_ZONE_COOKIE}=${encodeURIComponent(zone)}; Path=/; Max-Age=${60 * 60 * 24 * 365}; SameSite=Lax`
        prefs.value = { ...prefs.value, timeZone: zone }
      }
    })
  }

  const format = (value: string | number | Date | null | undefined, style: DateStyle = 'day') => (value === null || value === undefined || value === '' ? '—' : formatDate(value, style, prefs.value))
  /** A calendar day in the reader's words, with or without the year (the same options as `formatDay`). */
  const day = (value: string, { year = true } = {}) => format(value, year ? 'day' : 'dayShort')
  return { prefs: readonly(prefs), format, day }
}
