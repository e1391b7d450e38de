import { describe, expect, it } from 'vitest'

// One way of sorting tables: in memory, in the address, or as a signed `-key`.
type Key = 'title' | 'time'
const routines = [
  { title: 'Strides', time: 600 },
  { title: 'hill repeats', time: 2400 },
  { title: 'Gym circuit', time: 1800 },
  { title: 'Drills', time: 600 },
]
const value = (row: typeof routines[number], key: Key) => key === 'title' ? row.title.toLowerCase() : row.time

describe('sortRows', () => {
  it('orders numbers and text either way and keeps equal rows in their order', () => {
    expect(sortRows(routines, row => row.time).map(row => row.title)).toEqual(['Strides', 'Drills', 'Gym circuit', 'hill repeats'])
    expect(sortRows(routines, row => row.time, true).map(row => row.title)).toEqual(['hill repeats', 'Gym circuit', 'Strides', 'Drills'])
    expect(sortRows(routines, row => row.title.toLowerCase()).map(row => row.title)).toEqual(['Drills', 'Gym circuit', 'hill repeats', 'Strides'])
    expect(routines[0]!.title).toBe('Strides')
  })
})

describe('useSortedRows and useTableSort', () => {
  it('turns the same column round and starts another in its first direction', () => {
    const state = ref<SortState<Key>>({ key: 'title', descending: false })
    const table = useSortedRows(() => routines, value, state, key => key === 'time')
    expect(table.rows.value.map(row => row.title)).toEqual(['Drills', 'Gym circuit', 'hill repeats', 'Strides'])
    expect(table.ariaSort('title')).toBe('ascending')
    expect(table.ariaSort('time')).toBe('none')
    table.sortBy('title')
    expect(table.ariaSort('title')).toBe('descending')
    expect(table.rows.value[0]!.title).toBe('Strides')
    table.sortBy('time')
    expect(state.value).toEqual({ key: 'time', descending: true })
    expect(table.rows.value[0]!.title).toBe('hill repeats')
    expect(table.choice.value).toBe('time:desc')
    table.choice.value = 'title:asc'
    expect(state.value).toEqual({ key: 'title', descending: false })
  })

  it('keeps a signed sort (`-key` for descending) in the address', async () => {
    const query = useQueryState({ sort: 'name' })
    const table = useTableSort(signedSort<'name' | 'weekLoad'>(computed(() => query.state.value.sort), text => query.set({ sort: text })), key => key !== 'name')
    table.sortBy('weekLoad')
    await expect.poll(() => useRoute().query.sort).toBe('-weekLoad')
    expect(table.ariaSort('weekLoad')).toBe('descending')
    table.sortBy('weekLoad')
    await expect.poll(() => useRoute().query.sort).toBe('weekLoad')
    table.sortBy('name')
    await expect.poll(() => useRoute().query.sort).toBeUndefined()
    expect(table.ariaSort('name')).toBe('ascending')
  })
})
