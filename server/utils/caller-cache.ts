import type { Caller } from './auth'
import { ExpiringCache } from './expiring-cache'

/**
 * A small in-process cache of who is calling, keyed by the sealed session cookie exactly as the browser
 * sends it. A hit skips unsealing the cookie (key derivation, HMAC and decryption) and the four-table
 * lookup built by the query builder; requireTeamRole still checks the sign-in row and reads the role
 * with one fixed indexed statement, so revocation and role changes count at once from any process.
 * What the entry adds (name, email, time zone, team name) lives at most CALLER_CACHE_MS, never past the
 * sign-in's end, and is dropped at once on this process when the sign-in is revoked, the membership's
 * role changes or ends, or the person or the team is edited (see docs/performance.md).
 */
export const CALLER_CACHE_MS = 30_000
const MAX_ENTRIES = 2000

interface Entry { caller: Caller, tokenHash: string }

const entries = new ExpiringCache<Entry>(MAX_ENTRIES)
// Bumped by every forget, so a lookup that read a sign-in just before it was revoked is not remembered.
let generation = 0

/** Take before looking a caller up in the database; pass to rememberCaller. */
export function callerGeneration() {
  return generation
}

export function cachedCaller(cookie: string): Entry | undefined {
  return entries.get(cookie)
}

export function rememberCaller(cookie: string, caller: Caller, tokenHash: string, signInEndsAt: number, lookedUpAt: number) {
  if (lookedUpAt !== generation) return
  entries.set(cookie, { caller, tokenHash }, Math.min(Date.now() + CALLER_CACHE_MS, signInEndsAt))
}

/** Drops every cached caller matching all the given fields (sign-ins by token hash, a person, a team). */
export function forgetCallers(match: { tokenHashes?: Iterable<string>, userId?: number, teamId?: number }) {
  generation++
  const hashes = match.tokenHashes ? new Set(match.tokenHashes) : undefined
  entries.deleteWhere(entry => (!hashes || hashes.has(entry.tokenHash))
    && (match.userId === undefined || entry.caller.userId === match.userId)
    && (match.teamId === undefined || entry.caller.teamId === match.teamId))
}

export function cachedCallerCount() {
  return entries.size
}
