// Requests with bodies larger than this are refused before anything reads them.
const MAX_BODY_BYTES = 1_000_000

export default defineEventHandler((event) => {
  if (!event.path.startsWith('/api/')) return
  const length = Number(getRequestHeader(event, 'content-length') ?? 0)
  if (length > MAX_BODY_BYTES) {
    refuseField('_', 'The request body is larger than 1 MB', 413)
  }
})
