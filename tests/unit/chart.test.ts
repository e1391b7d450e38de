import { describe, expect, it } from 'vitest'
import { dayScale, fractionTicks, linePath, oneDecimal, plotArea, roundUpLeading, slots, topWithRoom, valueScale, valueTicks } from '../../shared/utils/chart'

const area = plotArea(640, 180, { top: 14, right: 16, bottom: 28, left: 44 })

describe('chart arithmetic', () => {
  it('takes the padding off the picture', () => {
    expect(area).toEqual({ width: 580, height: 138, left: 44, top: 14, right: 624, bottom: 152, outer: { width: 640, height: 180 } })
  })

  it('puts 0 at the bottom of the plot and the top value at its top', () => {
    const y = valueScale(area, 10)
    expect(y(0)).toBe(152)
    expect(y(10)).toBe(14)
    expect(y(5)).toBe(83)
  })

  it('leaves room above the largest value, and never goes below the floor', () => {
    expect(topWithRoom([3, 8, 5])).toBeCloseTo(8.8)
    expect(topWithRoom([])).toBeCloseTo(1.1)
    expect(topWithRoom([0.2], 2, 1)).toBe(2)
  })

  it('rounds an axis top up to its leading digit', () => {
    expect(roundUpLeading(437)).toBe(500)
    expect(roundUpLeading(1200)).toBe(2000)
    expect(roundUpLeading(1)).toBe(1)
    expect(roundUpLeading(90)).toBe(90)
  })

  it('gives each week an equal slot and its centre', () => {
    const { slot, x } = slots(area, 4)
    expect(slot).toBe(145)
    expect(x(0)).toBe(44 + 72.5)
    expect(x(3)).toBe(44 + 3 * 145 + 72.5)
    expect(slots(area, 0).slot).toBe(580)
  })

  it('spreads days over the width, and puts a single day in the middle', () => {
    const x = dayScale(area, ['2026-03-01', '2026-03-11', '2026-03-21'])
    expect(x('2026-03-01')).toBe(44)
    expect(x('2026-03-11')).toBe(44 + 290)
    expect(x('2026-03-21')).toBe(624)
    expect(dayScale(area, ['2026-03-01'])('2026-03-01')).toBe(334)
  })

  it('labels ticks at fractions of the top, or at given values', () => {
    const y = valueScale(area, 8.8)
    expect(fractionTicks(8.8, y, value => String(oneDecimal(value)))).toEqual([
      { y: 152, label: '0' },
      { y: 83, label: '4.4' },
      { y: 14, label: '8.8' },
    ])
    expect(valueTicks([0, 1, 2], valueScale(area, 2), value => value.toFixed(1)).map(tick => tick.label)).toEqual(['0.0', '1.0', '2.0'])
  })

  it('draws a path that lifts the pen over a gap', () => {
    expect(linePath([])).toBe('')
    expect(linePath([{ x: 1, y: 2 }, { x: 3.04, y: 4.06 }])).toBe('M1.0,2.0 L3.0,4.1')
    expect(linePath([{ x: 1, y: 2 }, null, { x: 5, y: 6 }, { x: 7, y: 8 }])).toBe('M1.0,2.0 M5.0,6.0 L7.0,8.0')
    expect(linePath([null, { x: 1, y: 1 }])).toBe('M1.0,1.0')
  })
})
