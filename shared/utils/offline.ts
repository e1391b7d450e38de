// What the service worker and the app agree on for offline use: cache names, the URLs it serves
// itself, which pages open with no network, and which reads are fetched ahead. Pure, so the worker
// (bundled on its own) and the pages share one definition.
import { addDays } from './dates'

export const offlineCaches = {
  /** Athlete API reads (plans, Today, profile…), keyed by their full URL. */
  api: 'switchback-api-v1',
  /** Demo clips and posters, keyed by the object's address without the signature. */
  clips: 'switchback-clips-v1',
  /** Small flags the worker must see across restarts (a sign-out still to send). Never personal data. */
  meta: 'switchback-meta-v1',
} as const

/** The app's own caches that may hold a person's data (the precache holds only the build's files). */
export const personalCaches: string[] = [offlineCaches.api, offlineCaches.clips]

/** A page rendered without server data: the app boots in the browser and reads its API from the cache. */
export const shellUrl = '/offline-shell'
/** Shown for pages that need the network (coach pages) when there is none. */
export const offlinePageUrl = '/offline.htm'
/** Where the worker plays a stored clip from, with range requests. */
export const offlineClipPath = '/offline-clip'
/** Meta-cache entry that says a sign-out could not reach the server and must be sent first. */
export const signOutPendingUrl = '/__switchback/sign-out-pending'

/** How many days ahead sessions (and their clips) are kept ready. */
export const prefetchDays = 7

const athletePages = ['/today', '/logbook', '/profile', '/progress', '/login']

/** Pages that open from the app shell with no network; everything else gets the offline page. */
export function opensOffline(path: string): boolean {
  if (path === '/' || path.startsWith('/session/')) return true
  return athletePages.some(page => path === page || path === `${page}/`)
}

/**
 * The stable name of a stored object: its address without the query, so the signature that changes
 * with every presigned URL does not make the same clip look new.
 */
export function clipStoreKey(url: string): string {
  const parsed = new URL(url)
  return `${parsed.origin}${parsed.pathname}`
}

export function offlineClipUrl(storeKey: string): string {
  return `${offlineClipPath}?src=${encodeURIComponent(storeKey)}`
}

export interface PrefetchAssignment { id: number, date: string, shownStatus?: string }

/**
 * The sessions to keep ready: today and the next `days` days, and any missed in the past week that
 * Today still offers.
 */
export function sessionsToKeep(assignments: PrefetchAssignment[], today: string, days = prefetchDays): number[] {
  const last = addDays(today, days)
  return assignments
    .filter(item => (item.date >= today && item.date <= last) || (item.date < today && item.shownStatus === 'overdue'))
    .map(item => item.id)
}

/** The logbook page's default range, the way `pages/logbook.vue` asks for it. */
export function defaultLogbookRange(now: Date): { from: string, to: string } {
  const isoDay = (date: Date) => date.toISOString().slice(0, 10)
  return { from: isoDay(new Date(now.getTime() - 27 * 86_400_000)), to: isoDay(now) }
}

/** The athlete pages' own reads (besides the session plans), as the pages request them. */
export function athleteReadUrls(now: Date): string[] {
  const logbook = defaultLogbookRange(now)
  return [
    '/api/_auth/session',
    '/api/me',
    '/api/me/assignments?missedDays=7',
    '/api/me/notifications',
    '/api/me/calendar-feed',
    '/api/me/profile',
    '/api/me/paces',
    `/api/me/logbook?from=${logbook.from}&to=${logbook.to}`,
    '/api/me/insights',
    '/api/me/pain-flags',
  ]
}

export function planUrl(assignmentId: number): string {
  return `/api/assignments/${assignmentId}/plan`
}

export function clipInfoUrl(exerciseId: number): string {
  return `/api/exercises/${exerciseId}/clip`
}

const planPattern = /^\/api\/assignments\/(\d+)\/plan$/
const clipInfoPattern = /^\/api\/exercises\/(\d+)\/clip$/

/** Which kind of kept read a cached API path is, for dropping the ones no longer needed. */
export function keptReadKind(path: string): 'plan' | 'clip' | 'page' {
  if (planPattern.test(path)) return 'plan'
  if (clipInfoPattern.test(path)) return 'clip'
  return 'page'
}

export function isClipInfoPath(path: string): boolean {
  return clipInfoPattern.test(path)
}

/** Storage keys (localStorage) the app writes; all of them are one person's and go at sign-out. */
export const storagePrefix = 'switchback.'

/**
 * Whether clips may be fetched now: on Wi-Fi or a wired connection, or on any connection when the
 * athlete allowed it. An unknown connection type (most desktop browsers, iOS) counts as not Wi-Fi,
 * and a data-saver setting always says no unless allowed.
 */
export function clipsAllowed(connection: { type?: string, saveData?: boolean } | undefined, allowMobileData: boolean): boolean {
  if (allowMobileData) return true
  if (!connection || connection.saveData) return false
  return connection.type === 'wifi' || connection.type === 'ethernet'
}
