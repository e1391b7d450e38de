// Offline upkeep for the whole app: logs waiting to send go out from any page, a sign-out made
// offline reaches the server first, data of another person never mixes in, and an athlete's next
// days are fetched ahead once the service worker is in place (production builds only).
export default defineNuxtPlugin((nuxtApp) => {
  const offline = useOfflineStore()
  const outbox = useSessionOutboxStore()
  const player = useSessionPlayerStore()
  const { session, loggedIn } = useUserSession()

  const isAthlete = () => loggedIn.value && session.value?.role === 'athlete'
  // A running session's own logs go first; fetching ahead waits for the next page after it.
  const sessionRunning = () => player.started && !player.finishedSent

  // Fetching ahead (a dozen reads, their cache writes) waits for a quiet moment, so that it never competes
  // with the page's own start or the first taps on a slow phone.
  const idle = () => new Promise<void>((resolve) => {
    if ('requestIdleCallback' in window) requestIdleCallback(() => resolve(), { timeout: 5000 })
    else setTimeout(resolve, 1000)
  })

  async function upkeep() {
    if (!navigator.onLine) return
    if (!await offline.sendPendingSignOut()) return
    if (!isAthlete() || !offline.workerReady || sessionRunning()) return
    await idle()
    if (!sessionRunning()) await offline.prefetchAhead()
  }

  nuxtApp.hook('app:mounted', () => {
    offline.loadSettings()
    // A page the server rendered has just been in touch with it.
    if (nuxtApp.payload.serverRendered && navigator.onLine) offline.touch()
    outbox.load()
    watch(() => outbox.lastSentAt, (at) => {
      if (at) offline.touch(at)
    })
    window.addEventListener('online', () => {
      offline.online = true
      void upkeep()
    })
    window.addEventListener('offline', () => {
      offline.online = false
    })
    watch(() => session.value?.user?.id, async (userId) => {
      if (userId) await offline.claimFor(userId)
      void upkeep()
    }, { immediate: true })
    navigator.serviceWorker?.ready.then(() => {
      offline.workerReady = true
      void upkeep()
    })
  })

  nuxtApp.hook('page:finish', () => {
    void upkeep()
  })
})
