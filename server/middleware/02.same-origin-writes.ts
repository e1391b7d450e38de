// Cross-site request forgery guard for every write under /api/ (sign-in and registration included).
// A browser on another site can send a form (urlencoded, multipart, text/plain) with our cookie, but
// not JSON without asking first (a CORS preflight we never grant), and it always says where it comes
// from. So a write must carry JSON (or no body), and come from our own origin by `Sec-Fetch-Site`
// or `Origin`. A request with neither header is not from a browser page and carries no forged cookie.
const writes = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

function refuse(message: string): never {
  refuseField('_', message, 403)
}

export default defineEventHandler((event) => {
  if (!writes.has(event.method) || !event.path.startsWith('/api/')) return
  const site = getRequestHeader(event, 'sec-fetch-site')
  const origin = getRequestHeader(event, 'origin')
  if (site && site !== 'same-origin' && site !== 'none') refuse('Requests from other sites are not accepted')
  if (origin && origin !== new URL(useServerConfig().appUrl).origin) refuse('Requests from other sites are not accepted')
  const hasBody = Number(getRequestHeader(event, 'content-length') ?? 0) > 0 || getRequestHeader(event, 'transfer-encoding') !== undefined
  const type = (getRequestHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  if (hasBody && type !== 'application/json') refuse('Send the request body as JSON (application/json)')
})
