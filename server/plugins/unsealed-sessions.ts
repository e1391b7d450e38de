import { defu } from 'defu'
import { unsealSession, type H3Event, type SessionConfig } from 'h3'
import { ExpiringCache } from '../utils/expiring-cache'

/** How long an unsealed session cookie is kept; the sign-in behind it is still checked on every request. */
export const UNSEALED_SESSION_MS = 30_000
const MAX_ENTRIES = 2000

// nuxt-auth-utils reads the session through h3's useSession, which unseals the cookie (key derivation, HMAC,
// decryption) every time: every rendered page asks /api/_auth/session, so every render paid for it. h3 looks
// for the request's session in `event.context.sessions` before unsealing, so a cookie unsealed in the last
// UNSEALED_SESSION_MS is put there from this cache, keyed by the sealed value exactly as sent. A hit holds
// exactly what unsealing that value gives, and never past the cookie's own `maxAge`; whether the sign-in is
// still live is not part of it (the session endpoint and requireTeamRole check that on every request).
export default defineNitroPlugin((nitroApp) => {
  const runtimeConfig = useRuntimeConfig()
  // The configuration nuxt-auth-utils passes to useSession.
  const config = defu(
    { password: process.env[`${runtimeConfig.nitro?.envPrefix || 'NUXT_'}SESSION_PASSWORD`] },
    runtimeConfig.session,
  ) as SessionConfig
  const name = config.name
  if (!name || !config.password) return
  const headerName = typeof config.sessionHeader === 'string' ? config.sessionHeader.toLowerCase() : `x-${name.toLowerCase()}-session`
  // Unsealed sessions, serialised, by the sealed value.
  const kept = new ExpiringCache<string>(MAX_ENTRIES)

  async function unsealed(event: H3Event, sealed: string): Promise<string | undefined> {
    const hit = kept.get(sealed)
    if (hit) return hit
    const session = await unsealSession(event, config, sealed).catch(() => undefined)
    // Anything h3 would not take as it is (it starts a new session instead) is left to h3.
    if (!session || typeof session.id !== 'string' || !session.id || typeof session.createdAt !== 'number') return undefined
    const keptUntil = Math.min(Date.now() + UNSEALED_SESSION_MS, config.maxAge ? session.createdAt + config.maxAge * 1000 : Infinity)
    const serialised = JSON.stringify(session)
    kept.set(sealed, serialised, keptUntil)
    return serialised
  }

  nitroApp.hooks.hook('request', async (event) => {
    if (event.context.sessions?.[name]) return
    // h3 takes a session header before the cookie.
    if (config.sessionHeader !== false && getRequestHeader(event, headerName) !== undefined) return
    const sealed = getCookie(event, name)
    if (!sealed) return
    const session = await unsealed(event, sealed)
    if (!session) return
    // A copy per request: handlers may change the session they are given.
    event.context.sessions ??= Object.create(null)
    event.context.sessions![name] = JSON.parse(session)
  })

  sessionHooks.hook('clear', (_session, event) => {
    const sealed = getCookie(event, name)
    if (sealed) kept.delete(sealed)
  })
})
