import { describe, expect, it } from 'vitest'
import { formatDate, pickLocale, pickTimeZone } from '../../shared/utils/date-format'

describe('formatDate', () => {
  it('writes a calendar day as that day in any time zone', () => {
    for (const timeZone of ['Pacific/Auckland', 'America/Los_Angeles', 'UTC']) {
      expect(formatDate('2026-03-03', 'day', { locale: 'en-GB', timeZone })).toBe('Tue, 3 Mar 2026')
    }
  })

  it('writes an instant in the reader\'s time zone', () => {
    const instant = '2026-03-03T23:30:00Z'
    expect(formatDate(instant, 'date', { locale: 'en-GB', timeZone: 'UTC' })).toBe('3 Mar 2026')
    expect(formatDate(instant, 'date', { locale: 'en-GB', timeZone: 'Pacific/Auckland' })).toBe('4 Mar 2026')
    expect(formatDate(instant, 'moment', { locale: 'en-GB', timeZone: 'America/Los_Angeles' })).toBe('3 Mar 2026, 15:30')
  })

  it('follows the locale\'s words and order', () => {
    expect(formatDate('2026-03-03', 'date', { locale: 'en-US', timeZone: 'UTC' })).toBe('Mar 3, 2026')
    expect(formatDate('2026-03-03', 'month', { locale: 'de-DE', timeZone: 'UTC' })).toBe('März 2026')
  })

  it('leaves something that is not a date as it came', () => {
    expect(formatDate('soon', 'day')).toBe('soon')
  })
})

describe('picking the reader\'s settings', () => {
  it('takes the first supported language of an Accept-Language header', () => {
    expect(pickLocale('fr-CA,fr;q=0.9,en;q=0.8')).toBe('fr-CA')
    expect(pickLocale('not a tag!, en-US')).toBe('en-US')
    expect(pickLocale(undefined)).toBe('en-GB')
  })

  it('keeps a known time zone and refuses an unknown one', () => {
    expect(pickTimeZone('Europe/London')).toBe('Europe/London')
    expect(pickTimeZone('Mars/Olympus')).toBe('UTC')
    expect(pickTimeZone(null)).toBe('UTC')
  })
})
