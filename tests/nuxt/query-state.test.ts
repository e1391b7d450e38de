import { afterEach, describe, expect, it } from 'vitest'

// useQueryState inside the app: the address is the state; the address holds only what differs from the defaults.
const defaults = { q: '', status: 'active', sort: 'name', dir: 'asc', page: 1 }
const options = { choices: { dir: ['asc', 'desc'] as const }, resets: ['page' as const] }

afterEach(async () => {
  await useRouter().replace({ query: {} })
})

describe('readQuery and writeQuery', () => {
  it('reads defaults for missing, empty, unusable and unlisted values', () => {
    expect(readQuery({}, defaults)).toEqual(defaults)
    expect(readQuery({ q: 'calf', page: '3', dir: 'sideways', status: '' }, defaults, options.choices)).toEqual({ q: 'calf', status: 'active', sort: 'name', dir: 'asc', page: 3 })
    expect(readQuery({ page: '0' }, defaults).page).toBe(1)
    expect(readQuery({ page: '2.5' }, defaults).page).toBe(1)
    expect(readQuery({ page: '-4' }, defaults).page).toBe(1)
    expect(readQuery({ q: ['first', 'second'] }, defaults).q).toBe('first')
    expect(readQuery({ date: '2026-02-30x' }, { date: '2026-03-02' }, { date: value => /^\d{4}-\d{2}-\d{2}$/.test(value) }).date).toBe('2026-03-02')
  })

  it('writes only what differs from the defaults, as text', () => {
    expect(writeQuery(defaults, defaults)).toEqual({})
    expect(writeQuery({ ...defaults, q: 'calf', dir: 'desc', page: 2 }, defaults)).toEqual({ q: 'calf', dir: 'desc', page: '2' })
  })
})

describe('useQueryState', () => {
  it('follows the address and writes changes back to it, sending the page back to 1', async () => {
    await useRouter().replace({ query: { q: 'hill', page: '4', other: 'kept' } })
    const query = useQueryState(defaults, options)
    expect(query.state.value).toMatchObject({ q: 'hill', page: 4 })
    await query.set({ status: 'archived' })
    expect(useRoute().query).toEqual({ q: 'hill', status: 'archived', other: 'kept' })
    expect(query.state.value.page).toBe(1)
    await query.set({ page: 2 })
    expect(useRoute().query).toEqual({ q: 'hill', status: 'archived', page: '2', other: 'kept' })
    await query.set({ status: 'active', q: '' })
    expect(useRoute().query).toEqual({ other: 'kept' })
  })

  it('gives one key as a writable value and a sort as column and direction', async () => {
    const query = useQueryState(defaults, options)
    const status = query.field('status')
    status.value = 'all'
    await expect.poll(() => useRoute().query.status).toBe('all')
    const sort = query.sortState<'name' | 'updated'>()
    expect(sort.value).toEqual({ key: 'name', descending: false })
    sort.value = { key: 'updated', descending: true }
    await expect.poll(() => useRoute().query).toMatchObject({ sort: 'updated', dir: 'desc' })
    expect(sort.value).toEqual({ key: 'updated', descending: true })
  })

  it('writes a search box to the address once typing pauses, trimmed', async () => {
    const query = useQueryState(defaults, options)
    const { text } = query.searchText('q', 20)
    text.value = ' calf'
    text.value = ' calf raise '
    expect(useRoute().query.q).toBeUndefined()
    await new Promise(resolve => setTimeout(resolve, 80))
    await expect.poll(() => useRoute().query.q).toBe('calf raise')
  })
})
