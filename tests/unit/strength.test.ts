import { describe, expect, it } from 'vitest'
import { e1rmBrzycki, e1rmEpley, loadForPercent, volumeLoad } from '../../shared/utils/strength'

describe('e1rmEpley — Epley (1985), "Poundage Chart"', () => {
  it('estimates 133.3 kg from 100 kg × 10', () => {
    expect(e1rmEpley(100, 10)).toBeCloseTo(133.333, 3)
    expect(e1rmEpley(80, 5)).toBeCloseTo(93.333, 3)
  })

  it('takes a single as its own 1RM', () => {
    expect(e1rmEpley(140, 1)).toBe(140)
  })

  it.each([[0, 5], [-50, 5], [100, 0], [100, 2.5], [Number.NaN, 5], [100, Number.POSITIVE_INFINITY], [5000, 5], [100, 500]])(
    'refuses %s kg × %s',
    (kg, reps) => {
      expect(() => e1rmEpley(kg, reps)).toThrow(RangeError)
    },
  )
})

describe('e1rmBrzycki — Brzycki (1993), "Strength testing — predicting a one-rep max from reps-to-fatigue"', () => {
  it('estimates 133.3 kg from 100 kg × 10 (100 × 36/27)', () => {
    expect(e1rmBrzycki(100, 10)).toBeCloseTo(133.333, 3)
    expect(e1rmBrzycki(100, 1)).toBe(100)
    expect(e1rmBrzycki(90, 5)).toBeCloseTo(101.25, 9)
  })

  it('refuses 37 reps or more, where the formula breaks down', () => {
    expect(() => e1rmBrzycki(100, 37)).toThrow(RangeError)
    expect(() => e1rmBrzycki(100, 40)).toThrow(RangeError)
    expect(e1rmBrzycki(100, 36)).toBe(3600)
  })
})

describe('loadForPercent', () => {
  it('rounds to the nearest 2.5 kg plate step by default (common practice, no published source)', () => {
    expect(loadForPercent(140, 80)).toBe(112.5)
    expect(loadForPercent(133.3, 75)).toBe(100)
    expect(loadForPercent(103, 80)).toBe(82.5)
  })

  it('rounds to another step, or not at all with 0', () => {
    expect(loadForPercent(140, 80, 5)).toBe(110)
    expect(loadForPercent(133.3, 70, 0)).toBeCloseTo(93.31, 9)
    expect(loadForPercent(100, 33, 0.5)).toBe(33)
  })

  it('refuses bad input', () => {
    expect(() => loadForPercent(0, 80)).toThrow(RangeError)
    expect(() => loadForPercent(100, -10)).toThrow(RangeError)
    expect(() => loadForPercent(100, 80, -2.5)).toThrow(RangeError)
    expect(() => loadForPercent(100, Number.NaN)).toThrow(RangeError)
  })
})

describe('volumeLoad', () => {
  it('sums kg × reps (common practice, no published source)', () => {
    expect(volumeLoad([{ kg: 100, reps: 5 }, { kg: 100, reps: 5 }, { kg: 90, reps: 8 }])).toBe(1720)
    expect(volumeLoad([])).toBe(0)
    expect(volumeLoad([{ kg: 0, reps: 12 }])).toBe(0)
  })

  it('refuses bad entries, naming the entry', () => {
    expect(() => volumeLoad([{ kg: 100, reps: 5 }, { kg: -20, reps: 5 }])).toThrow(/Entry 2/)
    expect(() => volumeLoad([{ kg: 100, reps: 1.5 }])).toThrow(RangeError)
  })
})
