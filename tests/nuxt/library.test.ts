import { afterEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { LibraryFilterBar, LibraryResults } from '#components'
import type { ExerciseView } from '#shared/schemas/exercise'

// The library's pieces write their choices into the address, which the page's fetch follows.
afterEach(async () => {
  await useRouter().replace({ query: {} })
})

const exercise = (id: number, name: string): ExerciseView => ({
  id,
  name,
  summary: `${name}, slowly`,
  category: 'strength',
  cues: [],
  equipment: ['step'],
  cautions: [],
  hasClip: id === 1,
  clip: null,
  hasPoster: false,
  archivedAt: null,
  createdAt: '2026-01-10T10:00:00.000Z',
  updatedAt: '2026-02-01T10:00:00.000Z',
})

describe('library filter bar', () => {
  it('shows the address\'s filters and writes a new choice back, on page 1', async () => {
    const bar = await mountSuspended(LibraryFilterBar, { props: { equipmentOptions: ['band', 'step'] }, route: '/?category=hill&page=3' })
    expect((bar.find('#library-category').element as HTMLSelectElement).value).toBe('hill')
    expect(bar.findAll('#library-equipment option').map(option => option.text())).toEqual(['Any equipment', 'band', 'step'])
    expect(bar.text()).toContain('(1 on)')
    await bar.find('#library-equipment').setValue('band')
    await expect.poll(() => useRoute().query).toEqual({ category: 'hill', equipment: 'band' })
    await bar.find('#library-sort').setValue('updated:desc')
    await expect.poll(() => useRoute().query).toEqual({ category: 'hill', equipment: 'band', sort: 'updated', dir: 'desc' })
  })

  it('writes the search once typing pauses, or at once on submit', async () => {
    const bar = await mountSuspended(LibraryFilterBar, { props: { equipmentOptions: [] } })
    await bar.find('#library-search').setValue('  calf ')
    await bar.find('form').trigger('submit')
    await expect.poll(() => useRoute().query.q).toBe('calf')
    // The paused-typing write that follows lands the same text.
    await new Promise(resolve => setTimeout(resolve, 300))
    expect(useRoute().query).toEqual({ q: 'calf' })
  })
})

describe('library results', () => {
  it('sorts by a column header through the address and pages on', async () => {
    const results = await mountSuspended(LibraryResults, { props: { items: [exercise(1, 'Calf raise'), exercise(2, 'Step-up')], pages: 3 }, route: '/?page=2' })
    expect(results.findAll('th[aria-sort]').map(cell => cell.attributes('aria-sort'))).toEqual(['ascending', 'none', 'none', 'none'])
    expect(results.findAll('tbody a').map(link => link.text())).toEqual(['Calf raise', 'Step-up'])
    expect(results.text()).toContain('Page 2 of 3')
    await results.findAll('th[aria-sort] button')[3]!.trigger('click')
    await expect.poll(() => useRoute().query).toEqual({ sort: 'updated', dir: 'desc' })
    await results.findAll('nav button')[1]!.trigger('click')
    await expect.poll(() => useRoute().query).toEqual({ sort: 'updated', dir: 'desc', page: '2' })
  })
})
