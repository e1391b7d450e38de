import { describe, expect, it } from 'vitest'
import {
  MILE_M,
  equivalentVo2max,
  flatEquivalentPace,
  formatDuration,
  formatPace,
  formatPaceRange,
  hillPaceForEffort,
  kmPaceToMilePace,
  milePaceToKmPace,
  minettiCost,
  paceFromRace,
  parseDuration,
  raceTimeForVo2max,
  riegel,
  trainingPaces,
} from '../../shared/utils/pace'

describe('parseDuration', () => {
  it('reads h:mm:ss, m:ss and plain seconds', () => {
    expect(parseDuration('1:23:45')).toBe(5025)
    expect(parseDuration('40:00')).toBe(2400)
    expect(parseDuration('45')).toBe(45)
    expect(parseDuration(' 4:05.5 ')).toBe(245.5)
    expect(parseDuration('0:00:30')).toBe(30)
  })

  it.each(['', 'abc', '1:2', '1:60', '1:00:75', '-5', '1:23:45:00', '12:3a', '4:', ':30', '1e3', '4..5'])(
    'throws a clear error for %j',
    (text) => {
      expect(() => parseDuration(text)).toThrow(/duration/)
    },
  )
})

describe('formatDuration', () => {
  it('writes h:mm:ss from an hour up and m:ss below', () => {
    expect(formatDuration(5025)).toBe('1:23:45')
    expect(formatDuration(2400)).toBe('40:00')
    expect(formatDuration(45)).toBe('0:45')
    expect(formatDuration(0)).toBe('0:00')
    expect(formatDuration(3600)).toBe('1:00:00')
  })

  it('rounds to the nearest second, carrying into minutes and hours', () => {
    expect(formatDuration(59.6)).toBe('1:00')
    expect(formatDuration(3599.5)).toBe('1:00:00')
    expect(formatDuration(44.4)).toBe('0:44')
  })

  it('round-trips with parseDuration', () => {
    for (const text of ['1:23:45', '40:00', '0:45', '10:00:01']) {
      expect(formatDuration(parseDuration(text))).toBe(text)
    }
  })

  it.each([-1, Number.NaN, Number.POSITIVE_INFINITY])('refuses %s', (seconds) => {
    expect(() => formatDuration(seconds)).toThrow(RangeError)
  })
})

describe('miles and kilometres', () => {
  it('uses the international mile: 1760 yd × 0.9144 m (International Yard and Pound Agreement, 1959)', () => {
    expect(MILE_M).toBe(1609.344)
  })

  it('4:00 /km is 6:26 /mi (common practice, no published source)', () => {
    expect(formatPace(240, 'km')).toBe('4:00 /km')
    expect(formatPace(240, 'mi')).toBe('6:26 /mi')
    expect(kmPaceToMilePace(240)).toBeCloseTo(386.24256, 9)
  })

  it('converts back from mile pace', () => {
    expect(milePaceToKmPace(kmPaceToMilePace(287))).toBeCloseTo(287, 9)
    expect(milePaceToKmPace(360)).toBeCloseTo(223.6936, 3)
  })

  it('refuses zero, negative and non-finite paces and unknown units', () => {
    expect(() => formatPace(0)).toThrow(RangeError)
    expect(() => formatPace(-240)).toThrow(RangeError)
    expect(() => kmPaceToMilePace(Number.NaN)).toThrow(RangeError)
    expect(() => formatPace(240, 'yd' as 'km')).toThrow(/unit/)
  })
})

describe('paceFromRace', () => {
  it('25 laps of a 400 m track are 10 km, so 40:00 is 4:00 /km (common practice, no published source)', () => {
    expect(paceFromRace(25 * 400, parseDuration('40:00'))).toBe(240)
  })

  it('refuses a zero distance or time', () => {
    expect(() => paceFromRace(0, 2400)).toThrow(RangeError)
    expect(() => paceFromRace(10_000, 0)).toThrow(RangeError)
    expect(() => paceFromRace(1e12, 2400)).toThrow(RangeError)
  })
})

describe('riegel', () => {
  it('predicts a marathon of 11,040 s from a 40:00 10K — Riegel (1981), "Athletic records and human endurance"', () => {
    // 2400 × 4.2195^1.06, worked by hand from Riegel's formula.
    expect(riegel(10_000, 2400, 42_195)).toBeCloseTo(11_040.4784, 3)
    expect(riegel(10_000, 2400, 21_097.5)).toBeCloseTo(5295.3674, 3)
  })

  it('predicts the benchmark itself and grows with distance', () => {
    expect(riegel(5000, 1200, 5000)).toBe(1200)
    const times = [1500, 5000, 10_000, 21_097.5, 42_195].map(distance => riegel(5000, 1200, distance))
    expect([...times].sort((a, b) => a - b)).toEqual(times)
  })

  it('refuses bad input', () => {
    expect(() => riegel(-5000, 1200, 10_000)).toThrow(RangeError)
    expect(() => riegel(5000, 1200, 10_000, 3)).toThrow(RangeError)
  })
})

describe('equivalentVo2max — Daniels & Gilbert (1979), "Oxygen Power"', () => {
  it('works a 40:00 10K through the two equations by hand', () => {
    // v = 250 m/min: VO2 = −4.60 + 0.182258·250 + 0.000104·250² = 47.4645;
    // %max at 40 min = 0.8 + 0.1894393·e^(−0.51112) + 0.2989558·e^(−7.73042) = 0.913761
    expect(equivalentVo2max(10_000, 2400)).toBeCloseTo(47.4645 / 0.9137614, 4)
  })

  it('matches the handbook tables (values from memory of Daniels\' Running Formula)', () => {
    expect(equivalentVo2max(5000, 1200)).toBeCloseTo(49.8, 0)
    expect(equivalentVo2max(10_000, 2400)).toBeCloseTo(51.9, 0)
  })

  it('falls as the time for a distance grows', () => {
    const values = [1100, 1200, 1300, 1500, 1800].map(time => equivalentVo2max(5000, time))
    expect([...values].sort((a, b) => b - a)).toEqual(values)
  })

  it('refuses impossible and meaningless races', () => {
    expect(() => equivalentVo2max(10_000, 600)).toThrow(/faster than humanly possible/)
    expect(() => equivalentVo2max(10_000, 0)).toThrow(RangeError)
    expect(() => equivalentVo2max(100, 10)).toThrow(RangeError)
    expect(() => equivalentVo2max(5000, 5 * 3600)).toThrow(/too slow/)
    expect(() => equivalentVo2max(Number.NaN, 1200)).toThrow(RangeError)
  })
})

describe('raceTimeForVo2max', () => {
  it('inverts equivalentVo2max to within half a second', () => {
    const races: [number, number][] = [[MILE_M, 300], [5000, 1200], [10_000, 2400], [21_097.5, 6000], [42_195, 14_400], [3000, 540]]
    for (const [distance, time] of races) {
      expect(Math.abs(raceTimeForVo2max(equivalentVo2max(distance, time), distance) - time)).toBeLessThan(0.5)
    }
  })

  it('is slower per kilometre the longer the race', () => {
    const paces = [MILE_M, 3000, 5000, 10_000, 21_097.5, 42_195].map(distance => raceTimeForVo2max(50, distance) / distance)
    expect([...paces].sort((a, b) => a - b)).toEqual(paces)
  })

  it('refuses a VO2max outside 10–100', () => {
    expect(() => raceTimeForVo2max(5, 5000)).toThrow(RangeError)
    expect(() => raceTimeForVo2max(150, 5000)).toThrow(RangeError)
  })
})

describe('trainingPaces', () => {
  const tenK = trainingPaces({ distanceM: 10_000, timeS: 2400 })

  it('a 10K benchmark predicts itself exactly', () => {
    expect(tenK.tenK).toBe(240)
    expect(trainingPaces({ distanceM: 5000, timeS: 1200 }).fiveK).toBe(240)
  })

  it('orders the zones from fastest to slowest', () => {
    const ordered = [tenK.mile, tenK.fiveK, tenK.tenK, tenK.threshold, tenK.marathon, tenK.easy.fast, tenK.easy.slow]
    expect([...ordered].sort((a, b) => a - b)).toEqual(ordered)
  })

  it('predicts the 5K and marathon from a 40:00 10K (values from memory of Daniels\' Running Formula tables)', () => {
    expect(tenK.fiveK * 5).toBeGreaterThan(19 * 60 + 10)
    expect(tenK.fiveK * 5).toBeLessThan(19 * 60 + 25)
    expect(Math.abs(tenK.marathon * 42.195 - parseDuration('3:04:36'))).toBeLessThan(90)
  })

  it('sets threshold at 88 % and easy at 59–74 % of VO2max (percentages from memory of Daniels\' Running Formula)', () => {
    const vo2max = 47.4645 / 0.9137614
    const oxygenCostAt = (secPerKm: number) => {
      const v = 60_000 / secPerKm
      return -4.60 + 0.182258 * v + 0.000104 * v * v
    }
    expect(oxygenCostAt(tenK.threshold) / vo2max).toBeCloseTo(0.88, 5)
    expect(oxygenCostAt(tenK.easy.fast) / vo2max).toBeCloseTo(0.74, 5)
    expect(oxygenCostAt(tenK.easy.slow) / vo2max).toBeCloseTo(0.59, 5)
  })

  it('refuses a benchmark outside the equations\' range', () => {
    expect(() => trainingPaces({ distanceM: 10_000, timeS: -1 })).toThrow(RangeError)
    expect(() => trainingPaces({ distanceM: 42_195, timeS: 12 * 3600 })).toThrow(/VO2max/)
  })
})

describe('Minetti et al. (2002), "Energy cost of walking and running at extreme uphill and downhill slopes"', () => {
  it('costs 3.6 J/kg/m on the flat and the polynomial\'s values on slopes', () => {
    // Each value worked by hand from 155.4i⁵ − 30.4i⁴ − 43.3i³ + 46.3i² + 19.5i + 3.6.
    expect(minettiCost(0)).toBe(3.6)
    expect(minettiCost(0.1)).toBeCloseTo(5.968214, 9)
    expect(minettiCost(-0.1)).toBeCloseTo(2.151706, 9)
    expect(minettiCost(0.2)).toBeCloseTo(9.006688, 9)
    expect(minettiCost(-0.2)).toBeCloseTo(1.800032, 9)
    expect(minettiCost(0.45)).toBeCloseTo(19.4260145625, 9)
    expect(minettiCost(-0.45)).toBeCloseTo(4.0323054375, 9)
  })

  it('is valid only from −45 % to +45 %', () => {
    expect(() => minettiCost(0.46)).toThrow(RangeError)
    expect(() => minettiCost(-0.5)).toThrow(RangeError)
    expect(() => minettiCost(Number.NaN)).toThrow(RangeError)
  })

  it('slows a 5:00 /km effort to about 8:17 /km up a 10 % slope', () => {
    expect(hillPaceForEffort(300, 0.1)).toBeCloseTo(300 * 5.968214 / 3.6, 6)
    expect(hillPaceForEffort(300, 0)).toBe(300)
    expect(hillPaceForEffort(300, -0.1)).toBeLessThan(300)
  })

  it('gets slower the steeper the climb', () => {
    const paces = [0, 0.04, 0.08, 0.15, 0.3, 0.45].map(grade => hillPaceForEffort(300, grade))
    expect([...paces].sort((a, b) => a - b)).toEqual(paces)
  })

  it('round-trips hill and flat-equivalent paces', () => {
    for (const grade of [-0.3, -0.08, 0, 0.05, 0.12, 0.45]) {
      expect(flatEquivalentPace(hillPaceForEffort(287, grade), grade)).toBeCloseTo(287, 9)
      expect(hillPaceForEffort(flatEquivalentPace(400, grade), grade)).toBeCloseTo(400, 9)
    }
  })

  it('refuses a bad pace', () => {
    expect(() => hillPaceForEffort(0, 0.1)).toThrow(RangeError)
    expect(() => flatEquivalentPace(Number.POSITIVE_INFINITY, 0.1)).toThrow(RangeError)
  })
})

describe('formatPaceRange', () => {
  // Common practice, no published source: a range reads fastest first, and collapses when both ends agree.
  it('shows both ends, or one pace when they round alike', () => {
    expect(formatPaceRange({ fast: 270, slow: 330 })).toBe('4:30 /km – 5:30 /km')
    expect(formatPaceRange({ fast: 300, slow: 300.2 })).toBe('5:00 /km')
    expect(formatPaceRange({ fast: 240, slow: 300 }, 'mi')).toBe('6:26 /mi – 8:03 /mi')
  })
})
