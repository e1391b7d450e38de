import { describe, expect, it } from 'vitest'
import { hasRole, isCoachRole } from '../../shared/utils/roles'

describe('roles', () => {
  it('treats head coaches and coaches as coaches, athletes and the signed-out as not', () => {
    expect(isCoachRole('head_coach')).toBe(true)
    expect(isCoachRole('coach')).toBe(true)
    expect(isCoachRole('athlete')).toBe(false)
    expect(isCoachRole(undefined)).toBe(false)
  })

  it('orders head coach above coach above athlete', () => {
    expect(hasRole('coach', 'head_coach')).toBe(false)
    expect(hasRole('head_coach', 'coach')).toBe(true)
    expect(hasRole('athlete', 'athlete')).toBe(true)
  })
})
