import { defineStore } from 'pinia'
import { ref } from 'vue'
import {
  athleteReadUrls,
  clipInfoUrl,
  clipsAllowed,
  clipStoreKey,
  keptReadKind,
  offlineCaches,
  offlineClipPath,
  personalCaches,
  planUrl,
  sessionsToKeep,
  signOutPendingUrl,
  storagePrefix,
} from '#shared/utils/offline'
import { useSessionOutboxStore } from './sessionOutbox'
import { useSessionPlayerStore } from './sessionPlayer'

// What this device keeps for working with no network: the athlete's reads and the next days'
// plans and clips (fetched ahead while online), when the app last reached the server, and the
// clean-up at sign-out. The service worker answers from the same caches (service-worker/sw.ts).

const CLIPS_SETTING_KEY = `${storagePrefix}offline.clipsOnMobileData`
const LAST_CONTACT_KEY = `${storagePrefix}offline.lastContact`
const OWNER_KEY = `${storagePrefix}offline.owner`
/** Fetch ahead at most this often while the app stays open (and again whenever the network returns). */
const PREFETCH_EVERY_MS = 10 * 60_000

export interface PrefetchSummary {
  at: number
  sessions: number
  clips: number
  clipsSkipped: boolean
}

export interface OfflineUsage {
  reads: number
  clips: number
  bytes: number
}

interface ClipInfo { url?: string | null, posterUrl?: string | null }
interface MyAssignments { today: string, assignments: { id: number, date: string, shownStatus?: string }[] }

type NetworkInformationLike = { type?: string, saveData?: boolean }

function hasCaches() {
  return import.meta.client && typeof caches !== 'undefined'
}

function absolute(path: string) {
  return new URL(path, window.location.origin).href
}

/** The stored object's key for a playback URL, whether it is the signed one or already our stored copy. */
function storeKeyOf(url: string | null | undefined): string | null {
  if (!url) return null
  if (url.startsWith(offlineClipPath)) return new URL(url, window.location.origin).searchParams.get('src')
  return /^https?:/.test(url) ? clipStoreKey(url) : null
}

export const useOfflineStore = defineStore('offline', () => {
  const online = ref(true)
  const lastContactAt = ref<number | null>(null)
  const workerReady = ref(false)
  const prefetching = ref(false)
  const lastPrefetch = ref<PrefetchSummary | null>(null)
  const prefetchError = ref('')
  const usage = ref<OfflineUsage | null>(null)
  const clipsOnMobileData = ref(false)

  function loadSettings() {
    if (!import.meta.client) return
    online.value = navigator.onLine
    clipsOnMobileData.value = localStorage.getItem(CLIPS_SETTING_KEY) === 'true'
    const stored = Number(localStorage.getItem(LAST_CONTACT_KEY))
    lastContactAt.value = Number.isFinite(stored) && stored > 0 ? stored : null
  }

  /** The server answered just now. */
  function touch(at = Date.now()) {
    lastContactAt.value = at
    try {
      localStorage.setItem(LAST_CONTACT_KEY, String(at))
    }
    catch {
      // Storage blocked: the time still shows for this visit.
    }
  }

  function setClipsOnMobileData(value: boolean) {
    clipsOnMobileData.value = value
    localStorage.setItem(CLIPS_SETTING_KEY, String(value))
  }

  function connection(): NetworkInformationLike | undefined {
    return (navigator as Navigator & { connection?: NetworkInformationLike }).connection
  }

  /** Sessions with a run in progress on this device keep their plan even past the window. */
  function sessionsInProgress(): number[] {
    const ids: number[] = []
    for (let index = 0; index < localStorage.length; index++) {
      const match = /^switchback\.player\.(\d+)\.v1$/.exec(localStorage.key(index) ?? '')
      if (match) ids.push(Number(match[1]))
    }
    return ids
  }

  /**
   * Fetches ahead what the athlete pages read, the plans of today, the next seven days and the
   * missed ones, and (on Wi-Fi or when allowed) their clips; drops what is no longer needed.
   */
  async function prefetchAhead(options: { force?: boolean } = {}) {
    if (!hasCaches() || prefetching.value || !navigator.onLine) return
    if (!options.force && lastPrefetch.value && Date.now() - lastPrefetch.value.at < PREFETCH_EVERY_MS) return
    prefetching.value = true
    prefetchError.value = ''
    try {
      const api = await caches.open(offlineCaches.api)
      const keep = new Set<string>()
      const read = async <T>(path: string): Promise<T | null> => {
        const url = absolute(path)
        const response = await fetch(url, { credentials: 'same-origin', headers: { accept: 'application/json' } })
        if (!response.ok) return null
        await api.put(url, response.clone())
        keep.add(url)
        return await response.json() as T
      }

      await Promise.all(athleteReadUrls(new Date()).map(path => read(path)))
      const mine = await api.match(absolute('/api/me/assignments?missedDays=7')).then(response => response?.json() as Promise<MyAssignments> | undefined)
      if (!mine) throw new Error('Your sessions could not be fetched.')
      const ids = [...new Set([...sessionsToKeep(mine.assignments, mine.today), ...sessionsInProgress()])]
      const plans = await Promise.all(ids.map(id => read<{ clipExerciseIds: number[] }>(planUrl(id))))
      const exerciseIds = [...new Set(plans.flatMap(plan => plan?.clipExerciseIds ?? []))]

      const clipsNow = clipsAllowed(connection(), clipsOnMobileData.value)
      let clipCount = 0
      if (clipsNow) {
        const clips = await caches.open(offlineCaches.clips)
        const keepClips = new Set<string>()
        for (const exerciseId of exerciseIds) {
          const info = await read<ClipInfo>(clipInfoUrl(exerciseId))
          for (const url of [info?.url, info?.posterUrl]) {
            const key = storeKeyOf(url)
            if (!url || !key) continue
            keepClips.add(key)
            if (await clips.match(key)) continue
            const response = await fetch(url, { mode: 'cors', credentials: 'omit' })
            if (response.ok) await clips.put(key, response)
          }
        }
        for (const request of await clips.keys()) {
          if (!keepClips.has(request.url)) await clips.delete(request)
        }
        clipCount = keepClips.size
      }
      else {
        // Not on Wi-Fi: keep what is stored for these sessions, fetch no new clips.
        for (const exerciseId of exerciseIds) keep.add(absolute(clipInfoUrl(exerciseId)))
      }
      // Old plans, clips of exercises no longer planned and an old logbook range go; a page read
      // that failed this time keeps its earlier copy.
      for (const request of await api.keys()) {
        if (keep.has(request.url)) continue
        const path = new URL(request.url).pathname
        if (keptReadKind(path) !== 'page' || path === '/api/me/logbook') await api.delete(request)
      }
      lastPrefetch.value = { at: Date.now(), sessions: plans.filter(Boolean).length, clips: clipCount, clipsSkipped: !clipsNow && exerciseIds.length > 0 }
      touch()
      await measure()
    }
    catch (error) {
      prefetchError.value = (error as Error).message || 'Could not fetch ahead.'
    }
    finally {
      prefetching.value = false
    }
  }

  /** Space the kept clips and reads take on this device. */
  async function measure() {
    if (!hasCaches()) return
    if (!await caches.has(offlineCaches.api) && !await caches.has(offlineCaches.clips)) {
      usage.value = null
      return
    }
    const clips = await caches.open(offlineCaches.clips)
    let bytes = 0
    const clipRequests = await clips.keys()
    for (const request of clipRequests) {
      const response = await clips.match(request)
      const length = Number(response?.headers.get('content-length'))
      bytes += Number.isFinite(length) && length > 0 ? length : (await response?.blob())?.size ?? 0
    }
    const reads = await (await caches.open(offlineCaches.api)).keys()
    usage.value = { reads: reads.length, clips: clipRequests.length, bytes }
  }

  /** The profile's "clear" button: plans, reads and clips go; logs waiting to send stay. */
  async function clearDownloads() {
    if (!hasCaches()) return
    await Promise.all(personalCaches.map(name => caches.delete(name)))
    lastPrefetch.value = null
    await measure()
  }

  /** Everything of the signed-in person leaves this device: caches, stored logs and settings. */
  async function forgetPerson() {
    useSessionOutboxStore().forget()
    useSessionPlayerStore().forget()
    if (hasCaches()) await Promise.all(personalCaches.map(name => caches.delete(name)))
    navigator.serviceWorker?.controller?.postMessage({ type: 'PURGE' })
    for (const key of Object.keys(localStorage)) {
      if (key.startsWith(storagePrefix)) localStorage.removeItem(key)
    }
    sessionStorage.clear()
    // The app keeps nothing in IndexedDB; any database here belongs to this origin's app alone.
    const databases = await indexedDB.databases?.().catch(() => []) ?? []
    await Promise.all(databases.map(database => database.name
      ? new Promise<void>((resolve) => {
          const request = indexedDB.deleteDatabase(database.name!)
          request.onsuccess = request.onerror = request.onblocked = () => resolve()
        })
      : Promise.resolve()))
    lastPrefetch.value = null
    usage.value = null
    lastContactAt.value = null
  }

  /** Who the kept data belongs to; a different person signing in on this device starts clean. */
  async function claimFor(userId: number) {
    const owner = localStorage.getItem(OWNER_KEY)
    if (owner && owner !== String(userId)) await forgetPerson()
    localStorage.setItem(OWNER_KEY, String(userId))
  }

  async function markSignOutPending() {
    if (!hasCaches()) return
    await (await caches.open(offlineCaches.meta)).put(signOutPendingUrl, new Response('1'))
  }

  /** Sends a sign-out that was made offline; true when none is left waiting. */
  async function sendPendingSignOut(): Promise<boolean> {
    if (!hasCaches() || !await caches.has(offlineCaches.meta)) return true
    const meta = await caches.open(offlineCaches.meta)
    if (!await meta.match(signOutPendingUrl)) return true
    try {
      const response = await fetch('/api/auth/logout', { method: 'POST', credentials: 'same-origin' })
      if (!response.ok && response.status !== 401) return false
      await meta.delete(signOutPendingUrl)
      return true
    }
    catch {
      return false
    }
  }

  return {
    online, lastContactAt, workerReady, prefetching, lastPrefetch, prefetchError, usage, clipsOnMobileData,
    loadSettings, touch, setClipsOnMobileData, prefetchAhead, measure, clearDownloads, forgetPerson, claimFor,
    markSignOutPending, sendPendingSignOut,
  }
})
