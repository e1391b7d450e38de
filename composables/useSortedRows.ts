import type { Ref, WritableComputedRef } from 'vue'

// Sortable tables, one way for all of them: which column and which way (kept by the page, in its
// address or in memory), the header's `aria-sort`, the phones' "Sort by" menu and, for tables sorted
// in the browser, the sorted rows. Tests: tests/nuxt/sorted-rows.test.ts.

export interface SortState<K extends string> {
  key: K
  descending: boolean
}

export type AriaSort = 'ascending' | 'descending' | 'none'

/** Rows in order of a value (numbers or lower-cased text), stable for equal values. */
export function sortRows<Row>(rows: readonly Row[], value: (row: Row) => string | number, descending = false): Row[] {
  return rows
    .map((row, index) => ({ row, index, value: value(row) }))
    .sort((a, b) => {
      const order = a.value < b.value ? -1 : a.value > b.value ? 1 : 0
      return (descending ? -order : order) || a.index - b.index
    })
    .map(item => item.row)
}

/** A sort kept as one text (`name` or `-name`, the minus for descending), as the team insights address has it. */
export function signedSort<K extends string>(text: Ref<string>, write: (text: string) => void): WritableComputedRef<SortState<K>> {
  return computed({
    get: () => ({ key: text.value.replace(/^-/, '') as K, descending: text.value.startsWith('-') }),
    set: ({ key, descending }) => write(descending ? `-${key}` : key),
  })
}

/**
 * A table's sort: `sortBy(key)` turns the same column round, or starts another column in its first
 * direction (`firstDescending`: numbers people compare and recent dates start from the top).
 */
export function useTableSort<K extends string>(state: Ref<SortState<K>> | WritableComputedRef<SortState<K>>, firstDescending: (key: K) => boolean = () => false) {
  function sortBy(key: K) {
    state.value = state.value.key === key
      ? { key, descending: !state.value.descending }
      : { key, descending: firstDescending(key) }
  }
  const ariaSort = (key: K): AriaSort => state.value.key !== key ? 'none' : state.value.descending ? 'descending' : 'ascending'
  /** The phones' "Sort by" menu, whose options are `key:asc` or `key:desc`. */
  const choice = computed({
    get: () => `${state.value.key}:${state.value.descending ? 'desc' : 'asc'}`,
    set: (value: string) => {
      const [key, way] = value.split(':')
      state.value = { key: key as K, descending: way === 'desc' }
    },
  })
  return { sort: state, sortBy, ariaSort, choice }
}

/** A table sorted in the browser: `useTableSort` and the rows in that order. */
export function useSortedRows<Row, K extends string>(
  rows: () => readonly Row[],
  value: (row: Row, key: K) => string | number,
  state: Ref<SortState<K>> | WritableComputedRef<SortState<K>>,
  firstDescending?: (key: K) => boolean,
) {
  const table = useTableSort(state, firstDescending)
  const sorted = computed(() => sortRows(rows(), row => value(row, state.value.key), state.value.descending))
  return { ...table, rows: sorted }
}
