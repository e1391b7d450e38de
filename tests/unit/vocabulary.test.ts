import { describe, expect, it } from 'vitest'
import { isUnder18 } from '../../shared/utils/age'
import { needsUrgentGuidance, urgentGuidance } from '../../shared/utils/urgent-guidance'
import { bodyAreaLabel, bodyAreas, effortScale, effortWords, exerciseCategoryLabel, plural, routineCategoryLabel } from '../../shared/utils/vocabulary'

describe('vocabulary', () => {
  it('has words for every body area and never shows a raw key', () => {
    for (const area of bodyAreas) expect(bodyAreaLabel(area)).not.toMatch(/_/)
    expect(bodyAreaLabel('quad')).toBe('Thigh (quadriceps)')
    expect(bodyAreaLabel('lower_back')).toBe('Lower back')
    expect(bodyAreaLabel('some_new_area')).toBe('Some new area')
  })

  it('names exercise and routine categories with the same words', () => {
    expect(exerciseCategoryLabel('hill')).toBe(routineCategoryLabel('hills'))
    expect(exerciseCategoryLabel('strength')).toBe(routineCategoryLabel('strength'))
  })

  it('has one effort scale with words for every point from 0 to 10', () => {
    expect(effortScale).toHaveLength(11)
    expect(new Set(effortScale).size).toBe(11)
    expect(effortWords(7)).toBe(effortScale[7])
    expect(effortWords(7.5)).toBe(effortScale[7])
    expect(effortWords(10)).toBe('Nothing left')
  })

  it('writes plurals right', () => {
    expect(plural(1, 'session')).toBe('1 session')
    expect(plural(2, 'session')).toBe('2 sessions')
    expect(plural(0, 'rep')).toBe('0 reps')
    expect(plural(3, 'body area', 'body areas')).toBe('3 body areas')
  })
})

describe('urgent guidance', () => {
  it('is needed from pain 7, or for sudden pain at any score (general first-aid practice)', () => {
    expect(needsUrgentGuidance({ pain: 6 })).toBe(false)
    expect(needsUrgentGuidance({ pain: 7 })).toBe(true)
    expect(needsUrgentGuidance({ pain: 2, sudden: true })).toBe(true)
  })

  it('names the team number, or the local emergency number when none is set', () => {
    expect(urgentGuidance('112').call).toMatch(/the emergency number 112/)
    expect(urgentGuidance(null).call).toMatch(/your local emergency number/)
    expect(urgentGuidance('  ').call).toMatch(/your local emergency number/)
  })
})

describe('isUnder18', () => {
  const today = new Date('2026-12-02T00:00:00Z')
  it('reads the birth year cautiously', () => {
    expect(isUnder18(2008, today)).toBe(true)
    expect(isUnder18(2007, today)).toBe(false)
    expect(isUnder18(null, today)).toBe(false)
  })
})
