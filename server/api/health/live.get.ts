/** Liveness: the process answers. Restart it only when this fails. */
export default defineEventHandler((event) => {
  setResponseHeader(event, 'cache-control', 'no-store')
  return { ok: true }
})
