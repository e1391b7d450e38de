// When the server fails on its side (5xx), the message a person sees carries the request's reference,
// the same id as the server's log line and the `x-request-id` header, so a report can be traced.
export default defineNuxtPlugin(() => {
  globalThis.$fetch = globalThis.$fetch.create({
    onResponseError({ response }) {
      const id = response.headers.get('x-request-id')
      const body = response._data as { message?: unknown, data?: { requestId?: string, fields?: Record<string, string> } } | undefined
      if (!id || !body || typeof body !== 'object' || response.status < 500) return
      const reference = ` (reference ${id.slice(0, 8)})`
      body.data = { ...body.data, requestId: id }
      if (typeof body.message === 'string' && !body.message.endsWith(reference)) body.message += reference
      const general = body.data.fields?._
      if (general && !general.endsWith(reference)) body.data.fields = { ...body.data.fields, _: general + reference }
    },
  })
})
