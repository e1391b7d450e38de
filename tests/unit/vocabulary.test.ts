import { describe, expect, it } from 'vitest'
import { isUnder18 } from '../../shared/utils/age'
import { needsUrgentGuidance, urgentGuidance } from '../../shared/utils/urgent-guidance'
import { bodyAreas, defineVocabulary, effortScale, effortWords, exerciseCategories, plural, routineCategories } from '../../shared/utils/vocabulary'

describe('defineVocabulary', () => {
  const sizes = defineVocabulary({ small: 'Small', extra_large: 'Extra large', medium: 'Medium' })

  it('keeps the label map\'s order for values and options', () => {
    expect(sizes.values).toEqual(['small', 'extra_large', 'medium'])
    expect(sizes.options).toEqual([
      { value: 'small', label: 'Small' },
      { value: 'extra_large', label: 'Extra large' },
      { value: 'medium', label: 'Medium' },
    ])
  })

  it('names known keys, tidies unknown ones and shows nothing for no key', () => {
    expect(sizes.label('extra_large')).toBe('Extra large')
    expect(sizes.label('very_small')).toBe('Very small')
    expect(sizes.label('toString')).toBe('ToString')
    expect(sizes.label(null)).toBe('')
    expect(sizes.label('')).toBe('')
  })

  it('gives every vocabulary an option per value, labelled from its map', () => {
    expect(exerciseCategories.options.map(option => option.value)).toEqual(exerciseCategories.values)
    expect(exerciseCategories.options.every(option => option.label === exerciseCategories.labels[option.value])).toBe(true)
    expect(bodyAreas.options).toHaveLength(bodyAreas.values.length)
  })
})

describe('vocabulary', () => {
  it('has words for every body area and never shows a raw key', () => {
    for (const area of bodyAreas.values) expect(bodyAreas.label(area)).not.toMatch(/_/)
    expect(bodyAreas.label('quad')).toBe('Thigh (quadriceps)')
    expect(bodyAreas.label('lower_back')).toBe('Lower back')
    expect(bodyAreas.label('some_new_area')).toBe('Some new area')
  })

  it('names exercise and routine categories with the same words', () => {
    expect(exerciseCategories.label('hill')).toBe(routineCategories.label('hills'))
    expect(exerciseCategories.label('strength')).toBe(routineCategories.label('strength'))
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
