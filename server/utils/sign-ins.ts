import type { H3Event } from 'h3'
import { and, eq, gt, lt, ne, type SQL } from 'drizzle-orm'
import { authSessions } from '../db/schema'

/** How long a sign-in lasts; matches the cookie's `maxAge` in nuxt.config.ts. */
export const SIGN_IN_DAYS = 30

/** Starts a server-side session row and returns the random id to keep in the sealed cookie. */
export async function startSignIn(userId: number, teamId: number) {
  const db = await useDb()
  const { token, hash } = newToken()
  await db.insert(authSessions).values({ tokenHash: hash, userId, teamId, expiresAt: new Date(Date.now() + SIGN_IN_DAYS * 24 * 3600_000) })
  // Expired rows are swept here, at the rare moment a new one is written.
  await db.delete(authSessions).where(lt(authSessions.expiresAt, new Date()))
  return token
}

/**
 * Every way a session ends goes through here, so the in-process cache of callers (caller-cache.ts)
 * forgets the ended sign-ins at once.
 */
async function revoke(where: SQL | undefined) {
  const db = await useDb()
  const ended = await db.delete(authSessions).where(where).returning({ id: authSessions.id, tokenHash: authSessions.tokenHash })
  if (ended.length) forgetCallers({ tokenHashes: ended.map(row => row.tokenHash) })
  return ended.length
}

/** Ends the sign-in whose cookie carries `sid`. */
export function endSignIn(sid: string) {
  return revoke(eq(authSessions.tokenHash, hashToken(sid)))
}

/** Ends every sign-in of a user (password reset, sign out everywhere); `keepSid` spares the caller's own. */
export function endAllSignIns(userId: number, keepSid?: string) {
  return revoke(keepSid
    ? and(eq(authSessions.userId, userId), ne(authSessions.tokenHash, hashToken(keepSid)))
    : eq(authSessions.userId, userId))
}

/** Ends a user's sign-ins for one team (their membership there ended). */
export function endSignInsInTeam(userId: number, teamId: number) {
  return revoke(and(eq(authSessions.userId, userId), eq(authSessions.teamId, teamId)))
}

/** The sign-in id carried in the caller's sealed cookie, if any. */
export async function currentSid(event: H3Event) {
  const session = await getUserSession(event)
  return typeof session.secure?.sid === 'string' ? session.secure.sid : undefined
}

/** Whether the sign-in with this id is still on record for this user. */
export async function signInIsLive(sid: string, userId: number) {
  const db = await useDb()
  const [row] = await db.select({ id: authSessions.id }).from(authSessions)
    .where(and(eq(authSessions.tokenHash, hashToken(sid)), eq(authSessions.userId, userId), gt(authSessions.expiresAt, new Date()))).limit(1)
  return Boolean(row)
}
