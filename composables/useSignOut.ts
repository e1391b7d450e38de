/**
 * Signing out also clears this device of the person's plans, clips and waiting logs. Offline, the
 * server cannot be told yet: everything local is cleared anyway, and the sign-out is sent first
 * thing when the network returns (by the service worker or the offline plugin).
 */
export function useSignOut() {
  const { session, clear } = useUserSession()
  const offline = useOfflineStore()
  const outbox = useSessionOutboxStore()

  async function signOut() {
    outbox.load()
    if (navigator.onLine && outbox.pending) await outbox.flush()
    if (outbox.pending) {
      const count = outbox.pending
      const confirmed = window.confirm(`${count} ${count === 1 ? 'log has' : 'logs have'} not reached the server yet. Signing out deletes ${count === 1 ? 'it' : 'them'} from this device. Sign out anyway?`)
      if (!confirmed) return
    }
    let reached = false
    try {
      await $fetch('/api/auth/logout', { method: 'POST' })
      reached = true
    }
    catch (error) {
      const status = (error as { statusCode?: number }).statusCode
      reached = Boolean(status && status < 500)
    }
    await offline.forgetPerson()
    if (reached) await clear().catch(() => undefined)
    else await offline.markSignOutPending()
    session.value = null
    // A fresh page leaves nothing of the person in memory either; without a service worker and
    // without a network that page could not load, so stay in the app then.
    if (navigator.onLine || navigator.serviceWorker?.controller) window.location.replace('/login')
    else await navigateTo('/login')
  }

  return { signOut }
}
