import { describe, expect, it } from 'vitest'
import { errorUnder } from '#shared/utils/errors'
import { benchmarkDistances, MARATHON_M, MILE_M } from '#shared/utils/pace'

describe('errorUnder', () => {
  const fields = { 'series.weeks': 'At most 26 weeks', 'routineId': 'Choose a routine', 'athleteIds': 'Choose at least one athlete' }

  it('finds a key itself before anything under it', () => {
    expect(errorUnder({ 'series': 'Pick the days', 'series.weeks': 'At most 26 weeks' }, 'series')).toBe('Pick the days')
    expect(errorUnder(fields, 'routineId')).toBe('Choose a routine')
  })

  it('finds a message under a prefix, but not under a longer name that only starts the same', () => {
    expect(errorUnder(fields, 'series')).toBe('At most 26 weeks')
    expect(errorUnder({ seriesStart: 'Wrong' }, 'series')).toBeUndefined()
  })

  it('takes the first of several keys that has a message', () => {
    expect(errorUnder(fields, 'squadId', 'athleteIds')).toBe('Choose at least one athlete')
    expect(errorUnder(fields, 'dates')).toBeUndefined()
  })
})

describe('benchmarkDistances', () => {
  it('offers each race distance once, in metres', () => {
    const meters = benchmarkDistances.map(distance => distance.meters)
    expect(new Set(meters).size).toBe(meters.length)
    expect(meters).toContain(MARATHON_M)
    expect(meters).toContain(MILE_M)
    // Half marathon: 21.0975 km, half of the 42.195 km marathon distance set by World Athletics rules.
    expect(benchmarkDistances.find(distance => distance.short === 'Half marathon')?.meters).toBe(MARATHON_M / 2)
  })
})
