// Clearing the cookie (our logout, or nuxt-auth-utils' own DELETE /api/_auth/session) also ends
// the server-side row, and the client's session fetch reports a revoked session as signed out.
export default defineNitroPlugin(() => {
  sessionHooks.hook('clear', async (session) => {
    const sid = (session as { secure?: { sid?: unknown } }).secure?.sid
    if (typeof sid === 'string') await endSignIn(sid)
  })
  sessionHooks.hook('fetch', async (session, event) => {
    if (!session.user) return
    const sid = session.secure?.sid
    if (typeof sid !== 'string' || !(await signInIsLive(sid, session.user.id))) {
      await clearUserSession(event)
      refuse(401, 'Your session has ended; sign in again')
    }
  })
})
