import { describe, expect, it } from 'vitest'
import { hrMaxTanaka, karvonen } from '../../shared/utils/heart'

describe('hrMaxTanaka — Tanaka, Monahan & Seals (2001), "Age-predicted maximal heart rate revisited"', () => {
  it('gives 180 bpm at 40 and 194 at 20', () => {
    expect(hrMaxTanaka(40)).toBe(180)
    expect(hrMaxTanaka(20)).toBe(194)
    expect(hrMaxTanaka(60)).toBe(166)
  })

  it('falls with age', () => {
    expect(hrMaxTanaka(30)).toBeGreaterThan(hrMaxTanaka(31))
  })

  it.each([-1, 0, 200, Number.NaN])('refuses an age of %s', (age) => {
    expect(() => hrMaxTanaka(age)).toThrow(RangeError)
  })
})

describe('karvonen — Karvonen, Kentala & Mustala (1957), heart-rate reserve', () => {
  it('puts 70 % of a 180/60 reserve at 144 bpm', () => {
    expect(karvonen(180, 60, 0.7)).toBeCloseTo(144, 9)
  })

  it('runs from the resting to the maximum heart rate', () => {
    expect(karvonen(190, 50, 0)).toBe(50)
    expect(karvonen(190, 50, 1)).toBe(190)
  })

  it('refuses an intensity outside 0..1 and a rest above max', () => {
    expect(() => karvonen(180, 60, 70)).toThrow(RangeError)
    expect(() => karvonen(180, 60, -0.1)).toThrow(RangeError)
    expect(() => karvonen(60, 80, 0.5)).toThrow(/below maximum/)
    expect(() => karvonen(Number.NaN, 60, 0.5)).toThrow(RangeError)
  })
})
