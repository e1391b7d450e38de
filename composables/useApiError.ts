import type { FieldMessages, RefusalData } from '#shared/utils/errors'

/** What the client needs from a failed `$fetch`/`useFetch` call. */
export interface ApiError {
  /** HTTP status, or 0 when no answer came back (offline, aborted, DNS). */
  status: number
  /** A sentence to show: the server's summary, else the caller's fallback. */
  message: string
  /** Messages for single fields, keyed by dotted input path; `_` is moved into `message`. */
  fields: FieldMessages
  /** The rest of the refusal's `data` (e.g. `currentVersion` of a routine save conflict). */
  data: RefusalData
}

interface FetchFailure {
  statusCode?: number
  status?: number
  response?: { status?: number }
  data?: { message?: string, data?: RefusalData } | null
}

/**
 * Reads any error thrown by `$fetch`/`useFetch` the same way, whatever the route:
 * the server refuses with `{ message, data: { message, fields } }` (server/utils/validation.ts).
 */
export function readApiError(error: unknown, fallback = 'Something went wrong; try again'): ApiError {
  const failure = (error ?? {}) as FetchFailure
  const status = failure.statusCode ?? failure.status ?? failure.response?.status ?? 0
  const data = failure.data?.data ?? {}
  const { _: general, ...fields } = data.fields ?? {}
  const message = general ?? data.message ?? failure.data?.message ?? fallback
  return { status, message, fields, data }
}

/** The first thing to tell someone about a failure: a field's message if there is one, else the summary. */
export function apiErrorMessage(error: unknown, fallback?: string) {
  const read = readApiError(error, fallback)
  return Object.values(read.fields)[0] ?? read.message
}

/** Error state for one form or action: `show(error)` after a failed call, `clear()` before the next. */
export function useApiError(fallback?: string) {
  const message = ref('')
  const fields = ref<FieldMessages>({})
  const status = ref(0)

  function show(error: unknown, override?: string) {
    const read = readApiError(error, override ?? fallback)
    message.value = read.message
    fields.value = read.fields
    status.value = read.status
    return read
  }

  function clear() {
    message.value = ''
    fields.value = {}
    status.value = 0
  }

  return { message: readonly(message), fields: readonly(fields), status: readonly(status), show, clear }
}
