import { randomUUID } from 'node:crypto'

const acceptedId = /^[\w.-]{8,64}$/

// Every request gets an id (the caller's own `x-request-id` if it looks like one), returned in the
// `x-request-id` header and shown with error messages, and one JSON log line when it ends (error
// answers are logged by server/error-handler.ts, since h3 skips this hook for them).
export default defineNitroPlugin((nitro) => {
  nitro.hooks.hook('request', (event) => {
    const offered = getRequestHeader(event, 'x-request-id')
    const requestId = offered && acceptedId.test(offered) ? offered : randomUUID()
    event.context.requestId = requestId
    event.context.requestStartedAt = performance.now()
    setResponseHeader(event, 'x-request-id', requestId)
  })
  nitro.hooks.hook('afterResponse', (event) => {
    logRequest(event, event.node.res.statusCode)
  })
})
