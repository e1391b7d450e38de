// The exercise library's filters, sort and page, kept in the address (tests/nuxt/query-state.test.ts).

export type LibrarySort = 'name' | 'category' | 'updated' | 'clip'

export const LIBRARY_PAGE_SIZE = 20

const defaults = { q: '', category: '', equipment: '', hasClip: '', status: 'active', sort: 'name' as string, dir: 'asc', page: 1 }

export function useLibraryFilters() {
  const query = useQueryState(defaults, {
    choices: { sort: ['name', 'category', 'updated', 'clip'], dir: ['asc', 'desc'] },
    resets: ['page'],
  })
  const filters = query.state
  // Recent changes and clips start with the newest and those that have one.
  const sort = useTableSort(query.sortState<LibrarySort>(), key => key === 'updated' || key === 'clip')
  const activeFilterCount = computed(() => [filters.value.category, filters.value.equipment, filters.value.hasClip, filters.value.status !== 'active'].filter(Boolean).length)
  return { ...query, filters, activeFilterCount, ...sort }
}
