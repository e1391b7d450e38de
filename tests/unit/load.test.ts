import { describe, expect, it } from 'vitest'
import { acwrEwma, acwrRolling, monotony, sessionLoad, strain, weeklyTotals } from '../../shared/utils/load'

const days = (count: number, load: number) => Array.from({ length: count }, () => load)

describe('sessionLoad — Foster et al. (2001), "A new approach to monitoring exercise training"', () => {
  it('multiplies the CR-10 session RPE by the minutes', () => {
    expect(sessionLoad(7, 60)).toBe(420)
    expect(sessionLoad(0, 45)).toBe(0)
  })

  it.each([[11, 60], [-1, 60], [5, -10], [5, Number.NaN], [5, 3000]])('refuses RPE %s for %s min', (rpe, minutes) => {
    expect(() => sessionLoad(rpe, minutes)).toThrow(RangeError)
  })
})

describe('weeklyTotals', () => {
  it('sums blocks of seven days from the oldest, the newest block partial', () => {
    expect(weeklyTotals([1, 2, 3, 4, 5, 6, 7, 8, 9, 10])).toEqual([28, 27])
    expect(weeklyTotals([5, 5, 5, 5], 2)).toEqual([10, 10])
    expect(weeklyTotals([])).toEqual([])
  })
})

describe('acwrRolling — Hulin et al. (2014); Gabbett (2016), "The training–injury prevention paradox"', () => {
  it('divides the last 7 days\' mean by the last 28 days\' mean', () => {
    // Chronic mean (21·100 + 7·200)/28 = 125, acute mean 200, worked by hand.
    expect(acwrRolling([...days(21, 100), ...days(7, 200)])).toBeCloseTo(1.6, 12)
  })

  it('uses only the most recent windows', () => {
    expect(acwrRolling([...days(10, 1000), ...days(28, 300)])).toBe(1)
  })

  it('is null with fewer days than the chronic window or no chronic load', () => {
    expect(acwrRolling(days(27, 100))).toBeNull()
    expect(acwrRolling(days(28, 0))).toBeNull()
  })

  it('refuses bad loads and windows', () => {
    expect(() => acwrRolling([...days(27, 100), -5])).toThrow(/day 28/)
    expect(() => acwrRolling(days(28, 100), 28, 7)).toThrow(RangeError)
    expect(() => acwrRolling(days(28, 100), 0, 28)).toThrow(RangeError)
    expect(() => acwrRolling([Number.NaN])).toThrow(RangeError)
  })
})

describe('acwrEwma — Williams et al. (2017), "Better way to determine the acute:chronic workload ratio?"', () => {
  it('works λ = 2/(N + 1) by hand over three days', () => {
    // Acute λ = 2/3: 10 → 16.667 → 32.222 (290/9); chronic λ = 1/2: 10 → 15 → 27.5; ratio 580/495.
    expect(acwrEwma([10, 20, 40], 2, 3)).toBeCloseTo(580 / 495, 12)
  })

  it('reads 1 for a steady load, because both averages start at the first day', () => {
    expect(acwrEwma(days(40, 350))).toBeCloseTo(1, 12)
  })

  it('rises above 1 after a spike and below 1 after a rest week', () => {
    expect(acwrEwma([...days(35, 300), ...days(7, 600)])).toBeGreaterThan(1.3)
    expect(acwrEwma([...days(35, 300), ...days(7, 0)])).toBeLessThan(0.7)
  })

  it('is null with fewer days than the chronic window or no chronic load', () => {
    expect(acwrEwma(days(27, 100))).toBeNull()
    expect(acwrEwma(days(30, 0))).toBeNull()
  })
})

describe('monotony and strain — Foster (1998), "Monitoring training in athletes with reference to overtraining syndrome"', () => {
  const week = [600, 200, 400, 500, 100, 650, 0]

  it('divides the mean daily load by the week\'s SD', () => {
    // Mean 350; squared deviations sum to 385,000, population SD √55,000 = 234.52, worked by hand.
    expect(monotony(week)).toBeCloseTo(350 / Math.sqrt(55_000), 9)
    expect(strain(week)).toBeCloseTo(2450 * 350 / Math.sqrt(55_000), 6)
  })

  it('is null when every day is the same', () => {
    expect(monotony(days(7, 300))).toBeNull()
    expect(monotony(days(7, 0.1))).toBeNull()
    expect(strain(days(7, 300))).toBeNull()
  })

  it('refuses a week of fewer than 2 days or bad loads', () => {
    expect(() => monotony([300])).toThrow(RangeError)
    expect(() => monotony([300, Number.POSITIVE_INFINITY])).toThrow(RangeError)
  })
})
