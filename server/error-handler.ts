import type { H3Error } from 'h3'

/**
 * Runs before Nuxt's and Nitro's own error handlers and only reshapes the error they render:
 * a database that cannot take a write becomes a 503 with a clear message instead of a 500, and every
 * error answer carries the request id that the request log and the `x-request-id` header show.
 */
export default defineNitroErrorHandler((error: H3Error, event) => {
  const requestId = event.context.requestId as string | undefined
  const unavailable = databaseUnavailableMessage(error)
  if (unavailable) {
    error.statusCode = 503
    error.statusMessage = 'Service Unavailable'
    error.message = unavailable
    error.unhandled = false
    error.data = { message: unavailable, fields: {} }
    setResponseHeader(event, 'retry-after', 5)
  }
  if (requestId && (error.data === undefined || (typeof error.data === 'object' && error.data !== null && !Array.isArray(error.data)))) {
    error.data = { ...(error.data as Record<string, unknown> | undefined), requestId }
  }
  event.context.errorCode = sqliteCodeOf(error)
  logRequest(event, error.statusCode || 500)
})
