/// <reference lib="webworker" />
// Switchback's service worker (built by @vite-pwa/nuxt with injectManifest; registered only in
// production builds). It keeps the app's own files, opens athlete pages with no network, answers
// athlete reads from the cache when the network fails, and plays stored clips. See docs/offline.md.
import { clientsClaim } from 'workbox-core'
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute } from 'workbox-precaching'
import { createPartialResponse } from 'workbox-range-requests'
import { registerRoute } from 'workbox-routing'
import {
  clipStoreKey,
  isClipInfoPath,
  offlineCaches,
  offlineClipPath,
  offlineClipUrl,
  offlinePageUrl,
  opensOffline,
  personalCaches,
  shellUrl,
  signOutPendingUrl,
} from '../shared/utils/offline'

declare const self: ServiceWorkerGlobalScope

/** After this long without an answer, a stored copy is used (the network may still answer later). */
const API_WAIT_MS = 6000
const PAGE_WAIT_MS = 8000

precacheAndRoute(self.__WB_MANIFEST)
cleanupOutdatedCaches()
// The first install takes the open page at once; a later version waits for the athlete's go-ahead.
clientsClaim()

self.addEventListener('message', (event) => {
  const type = (event.data as { type?: string } | null)?.type
  if (type === 'SKIP_WAITING') void self.skipWaiting()
  else if (type === 'PURGE') event.waitUntil(purge())
})

async function purge() {
  await Promise.all(personalCaches.map(name => caches.delete(name)))
}

/** A sign-out made offline is sent before anything else reaches the server. */
async function sendPendingSignOut() {
  if (!await caches.has(offlineCaches.meta)) return
  const meta = await caches.open(offlineCaches.meta)
  if (!await meta.match(signOutPendingUrl)) return
  try {
    const response = await fetch('/api/auth/logout', { method: 'POST', credentials: 'same-origin' })
    if (response.ok || response.status === 401) await meta.delete(signOutPendingUrl)
  }
  catch {
    // Still no network: try again with the next page.
  }
}

function wait(ms: number) {
  return new Promise<'timeout'>(resolve => setTimeout(() => resolve('timeout'), ms))
}

registerRoute(
  ({ request, url }) => request.mode === 'navigate' && url.origin === self.location.origin,
  async ({ request, url }) => {
    await sendPendingSignOut()
    const network = fetch(request)
    const first = await Promise.race([network.catch(() => 'failed' as const), wait(PAGE_WAIT_MS)])
    if (first instanceof Response) return first
    const fallback = await matchPrecache(opensOffline(url.pathname) ? shellUrl : offlinePageUrl)
    return fallback ?? network
  },
)

registerRoute(
  ({ request, url }) => request.method === 'GET' && url.origin === self.location.origin && url.pathname === offlineClipPath,
  async ({ request, url }) => {
    const src = url.searchParams.get('src')
    const stored = src && await caches.has(offlineCaches.clips) ? await (await caches.open(offlineCaches.clips)).match(src) : undefined
    if (!stored) return new Response('This clip is not stored on this device.', { status: 404, headers: { 'content-type': 'text/plain' } })
    return request.headers.has('range') ? createPartialResponse(request, stored) : stored
  },
)

async function lookup(cache: Cache, request: Request, exact = false) {
  const stored = await cache.match(request, { ignoreVary: true })
  if (stored || exact) return stored
  // The same read with other query values (another date range) is better than nothing offline.
  return cache.match(request, { ignoreVary: true, ignoreSearch: true })
}

/**
 * Network first. Only reads the app fetched ahead for an athlete are in the cache, and only those
 * are refreshed here, so nothing of a coach is ever stored.
 */
async function networkFirst(request: Request, event: ExtendableEvent) {
  // Nothing kept (a coach, or nothing fetched ahead yet): straight to the network, nothing stored.
  if (!await caches.has(offlineCaches.api)) return fetch(request)
  const cache = await caches.open(offlineCaches.api)
  const network = fetch(request).then(async (response) => {
    if (response.ok && await lookup(cache, request, true)) await cache.put(request, response.clone())
    return response
  })
  event.waitUntil(network.then(() => undefined, () => undefined))
  const first = await Promise.race([network.catch(() => 'failed' as const), wait(API_WAIT_MS)])
  if (first instanceof Response) return first
  const stored = await lookup(cache, request)
  if (stored) return stored
  return first === 'timeout' ? network : Response.error()
}

/** A clip's playback answer points at the stored copy when there is one (its signed URL expires). */
async function withStoredClip(response: Response) {
  if (!response.ok || !await caches.has(offlineCaches.clips)) return response
  const body = await response.clone().json().catch(() => null) as Record<string, unknown> | null
  if (!body) return response
  const clips = await caches.open(offlineCaches.clips)
  let changed = false
  for (const field of ['url', 'posterUrl']) {
    const value = body[field]
    if (typeof value !== 'string' || !/^https?:/.test(value)) continue
    const key = clipStoreKey(value)
    if (await clips.match(key)) {
      body[field] = offlineClipUrl(key)
      changed = true
    }
  }
  if (!changed) return response
  const headers = new Headers(response.headers)
  headers.delete('content-length')
  return new Response(JSON.stringify(body), { status: response.status, statusText: response.statusText, headers })
}

registerRoute(
  // Reads made by the app's own code (not <video> or <img> loads), never writes.
  ({ request, url }) => request.method === 'GET' && request.destination === '' && url.origin === self.location.origin
    && url.pathname.startsWith('/api/') && url.pathname !== '/api/health',
  async ({ request, url, event }) => {
    const response = await networkFirst(request, event as ExtendableEvent)
    return isClipInfoPath(url.pathname) && !url.searchParams.has('redirect') ? withStoredClip(response) : response
  },
)
