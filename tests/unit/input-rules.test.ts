import { describe, expect, it } from 'vitest'
import { idParam, planDateSchema } from '../../shared/schemas/common'
import { benchmarkProblem, trainingPacesOrNull } from '../../shared/utils/pace'

describe('path ids', () => {
  it('takes digits only', () => {
    expect(idParam.parse('16')).toBe(16)
    for (const bad of ['0x10', '1e1', ' 1', '1 ', '1.0', '-1', '0', '+1', '', '9999999999999999']) {
      expect(idParam.safeParse(bad).success, JSON.stringify(bad)).toBe(false)
    }
  })
})

describe('plan dates', () => {
  it('stay within five years of today', () => {
    const year = new Date().getUTCFullYear()
    expect(planDateSchema.safeParse(new Date().toISOString().slice(0, 10)).success).toBe(true)
    expect(planDateSchema.safeParse(`${year + 4}-06-01`).success).toBe(true)
    expect(planDateSchema.safeParse(`${year + 6}-01-01`).success).toBe(false)
    expect(planDateSchema.safeParse(`${year - 6}-12-31`).success).toBe(false)
    expect(planDateSchema.safeParse('9999-12-31').success).toBe(false)
  })
})

describe('benchmark races', () => {
  // The limits are the pace code's own: Daniels & Gilbert (1979), "Oxygen Power", covers races of
  // 400 m to 100 km and VO2max 10–100; the speed cap is "common practice, no published source".
  it('refuses what the pace equations cannot use', () => {
    expect(benchmarkProblem({ distanceM: 250_000, timeS: 30 })).toMatch(/.+/)
    expect(benchmarkProblem({ distanceM: 400, timeS: 48 * 3600 })).toMatch(/.+/)
    expect(trainingPacesOrNull({ distanceM: 250_000, timeS: 30 })).toBeNull()
  })

  it('accepts an ordinary race', () => {
    expect(benchmarkProblem({ distanceM: 5000, timeS: 20 * 60 })).toBeNull()
    expect(trainingPacesOrNull({ distanceM: 5000, timeS: 20 * 60 })).not.toBeNull()
  })
})
