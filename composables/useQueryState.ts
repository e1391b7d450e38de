import { useDebounceFn } from '@vueuse/core'
import type { LocationQuery } from 'vue-router'

// State that lives in the page's address (filters, sort, page number), so a view can be shared,
// reloaded and gone back to. The page names each key with its default; the address holds only what
// differs from the defaults. Tests: tests/nuxt/query-state.test.ts.

export type QueryValues = Record<string, string | number>

export interface QueryStateOptions<T extends QueryValues> {
  /** The values a text key may take (a list, or a check); anything else in the address reads as the default. */
  choices?: { [K in keyof T]?: readonly string[] | ((value: string) => boolean) }
  /** Keys that go back to their default whenever a change does not set them (a page number). */
  resets?: (keyof T)[]
}

/**
 * Reads the keys from an address's query. Text keys take the first value given; number keys take
 * whole numbers from 1 up (page numbers); anything missing or unusable reads as the default.
 */
export function readQuery<T extends QueryValues>(query: LocationQuery, defaults: T, choices: QueryStateOptions<T>['choices'] = {}): T {
  const state: QueryValues = {}
  for (const [key, fallback] of Object.entries(defaults)) {
    const given = query[key]
    const raw = Array.isArray(given) ? given[0] : given
    if (typeof raw !== 'string' || raw === '') state[key] = fallback
    else if (typeof fallback === 'number') state[key] = /^\d+$/.test(raw) && Number(raw) >= 1 ? Number(raw) : fallback
    else state[key] = accepts(choices[key as keyof T], raw) ? raw : fallback
  }
  return state as T
}

function accepts(choice: readonly string[] | ((value: string) => boolean) | undefined, value: string) {
  if (!choice) return true
  return typeof choice === 'function' ? choice(value) : choice.includes(value)
}

/** The query for a state: every key that differs from its default and is not empty, as text. */
export function writeQuery<T extends QueryValues>(state: T, defaults: T): Record<string, string> {
  return Object.fromEntries(Object.entries(state)
    .filter(([key, value]) => value !== '' && value !== defaults[key])
    .map(([key, value]) => [key, String(value)]))
}

export function useQueryState<T extends QueryValues>(defaults: T | (() => T), options: QueryStateOptions<T> = {}) {
  const route = useRoute()
  const router = useRouter()
  const defaultsNow = () => (typeof defaults === 'function' ? defaults() : defaults)
  const state = computed(() => readQuery(route.query, defaultsNow(), options.choices))

  /** Changes some keys (and sends the `resets` keys not named back to their defaults); other query keys stay. */
  function set(changes: Partial<T>) {
    const base = defaultsNow()
    const reset = Object.fromEntries((options.resets ?? []).filter(key => !(key in changes)).map(key => [key, base[key]]))
    const next = { ...state.value, ...reset, ...changes } as T
    const others = Object.fromEntries(Object.entries(route.query).filter(([key]) => !(key in base)))
    return router.replace({ query: { ...others, ...writeQuery(next, base) } })
  }

  /** One key as a writable value, for `v-model`. */
  function field<K extends keyof T>(key: K) {
    return computed<T[K]>({
      get: () => state.value[key],
      set: (value) => {
        set({ [key]: value } as unknown as Partial<T>)
      },
    })
  }

  /** A search box's text: typed freely, written to the address (trimmed) once typing pauses. */
  function searchText<K extends keyof T>(key: K, waitMs = 250) {
    const text = ref(String(state.value[key]))
    const apply = useDebounceFn(() => set({ [key]: text.value.trim() } as unknown as Partial<T>), waitMs)
    watch(text, apply)
    const applyNow = () => set({ [key]: text.value.trim() } as unknown as Partial<T>)
    return { text, applyNow }
  }

  /** A table's sort kept as two keys, the column and `asc`/`desc`, for useTableSort / useSortedRows. */
  function sortState<S extends string>(sortKey: keyof T & string = 'sort', dirKey: keyof T & string = 'dir') {
    return computed<SortState<S>>({
      get: () => ({ key: String(state.value[sortKey]) as S, descending: state.value[dirKey] === 'desc' }),
      set: ({ key, descending }) => {
        set({ [sortKey]: key, [dirKey]: descending ? 'desc' : 'asc' } as unknown as Partial<T>)
      },
    })
  }

  return { state, set, field, searchText, sortState }
}
