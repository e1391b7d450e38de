import type { Caller } from './auth'

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

interface Entry { caller: Caller, tokenHash: string, expiresAt: number }

const entries = new Map<string, Entry>()
// Bumped by every forget, so a lookup that read a sign-in just before it was revoked is not remembered.
let generation = 0

/** Take before looking a caller up in the database; pass to rememberCaller. */
export function callerGeneration() {
  return generation
}

export function cachedCaller(cookie: string): Entry | undefined {
  const entry = entries.get(cookie)
  if (!entry) return undefined
  if (entry.expiresAt <= Date.now()) {
    entries.delete(cookie)
    return undefined
  }
  // Most recently used last, so the oldest is first to go when the cache is full.
  entries.delete(cookie)
  entries.set(cookie, entry)
  return entry
}

export function rememberCaller(cookie: string, caller: Caller, tokenHash: string, signInEndsAt: number, lookedUpAt: number) {
  if (lookedUpAt !== generation) return
  if (entries.size >= MAX_ENTRIES) entries.delete(entries.keys().next().value!)
  entries.set(cookie, { caller, tokenHash, expiresAt: Math.min(Date.now() + CALLER_CACHE_MS, signInEndsAt) })
}

/** Drops every cached caller matching all the given fields (sign-ins by token hash, a person, a team). */
export function forgetCallers(match: { tokenHashes?: Iterable<string>, userId?: number, teamId?: number }) {
  generation++
  const hashes = match.tokenHashes ? new Set(match.tokenHashes) : undefined
  for (const [cookie, entry] of entries) {
    if (hashes && !hashes.has(entry.tokenHash)) continue
    if (match.userId !== undefined && entry.caller.userId !== match.userId) continue
    if (match.teamId !== undefined && entry.caller.teamId !== match.teamId) continue
    entries.delete(cookie)
  }
}

export function cachedCallerCount() {
  return entries.size
}
