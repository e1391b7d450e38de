import type { H3Event } from 'h3'
import { and, eq, gt } from 'drizzle-orm'
import type { Role } from '#shared/utils/vocabulary'
import { authSessions, memberships, teams, users } from '../db/schema'

export interface Caller {
  userId: number
  teamId: number
  role: Role
  name: string
  email: string
  timezone: string
  teamName: string
}

/**
 * Who is calling, with their role in the team their session is for.
 * 401 when signed out (or the membership is gone), 403 when the role is below `minimum`.
 */
export async function requireTeamRole(event: H3Event, minimum: Role = 'athlete'): Promise<Caller> {
  const cookie = getCookie(event, sessionCookieName())
  const hit = cookie ? cachedCaller(cookie) : undefined
  if (hit) {
    // Still one read per request, but a single indexed lookup with a fixed statement: no cookie to
    // unseal and no query to build. A sign-in ended or a role changed by any process counts at once.
    const db = await useDb()
    const live = await db.$client.execute({ sql: liveSignInSql, args: [hit.tokenHash, hit.caller.userId, hit.caller.teamId, Date.now()] })
    const role = live.rows[0]?.role as Role | undefined
    if (role) {
      assertRole(role, minimum)
      event.context.caller = { ...hit.caller, role }
      return event.context.caller as Caller
    }
    forgetCallers({ tokenHashes: [hit.tokenHash] })
  }
  const session = await getUserSession(event)
  const sid = session.secure?.sid
  if (!session.user || !session.teamId || typeof sid !== 'string') {
    refuse(401, 'Sign in first')
  }
  const db = await useDb()
  const tokenHash = hashToken(sid)
  const lookedUpAt = callerGeneration()
  // One lookup: the live sign-in row, the membership it is for, the person and the team.
  const [row] = await db.select({
    role: memberships.role,
    name: users.name,
    email: users.email,
    timezone: users.timezone,
    teamName: teams.name,
    expiresAt: authSessions.expiresAt,
  }).from(authSessions)
    .innerJoin(memberships, and(eq(memberships.userId, authSessions.userId), eq(memberships.teamId, authSessions.teamId)))
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(
      eq(authSessions.tokenHash, tokenHash),
      eq(authSessions.userId, session.user.id),
      eq(authSessions.teamId, session.teamId),
      gt(authSessions.expiresAt, new Date()),
    ))
    .limit(1)
  if (!row) {
    await clearUserSession(event)
    refuse(401, 'Your session has ended; sign in again')
  }
  const { expiresAt, ...found } = row
  const caller: Caller = { userId: session.user.id, teamId: session.teamId, ...found }
  if (cookie) rememberCaller(cookie, caller, tokenHash, expiresAt.getTime(), lookedUpAt)
  assertRole(caller.role, minimum)
  event.context.caller = { ...caller }
  return event.context.caller as Caller
}

function assertRole(role: Role, minimum: Role) {
  if (!hasRole(role, minimum)) {
    refuse(403, minimum === 'head_coach' ? 'Only the head coach can do this' : minimum === 'coach' ? 'Only coaches can do this' : 'Not allowed')
  }
}

const liveSignInSql = `SELECT m.role AS role FROM auth_sessions s
  JOIN memberships m ON m.team_id = s.team_id AND m.user_id = s.user_id
  WHERE s.token_hash = ? AND s.user_id = ? AND s.team_id = ? AND s.expires_at > ? LIMIT 1`

let cookieName: string | undefined

/** The sealed session cookie's name (nuxt-auth-utils' default unless the runtime config names one). */
export function sessionCookieName() {
  cookieName ??= (useRuntimeConfig().session as { name?: string } | undefined)?.name || 'nuxt-session'
  return cookieName
}

export async function requireCoach(event: H3Event) {
  return requireTeamRole(event, 'coach')
}

/** Team settings, coaches' memberships and roles, deleting the team. */
export async function requireHeadCoach(event: H3Event) {
  return requireTeamRole(event, 'head_coach')
}

/**
 * Starts a sign-in: a new server-side session row, and a sealed cookie carrying only its random id
 * (plus the name and role that shape the client). Any sign-in this browser had before ends.
 * The role in the cookie only shapes the client; every route re-reads it from the database.
 */
export async function signIn(event: H3Event, user: { id: number, name: string, email: string }, teamId: number, role: Role) {
  const previous = await currentSid(event)
  if (previous) await endSignIn(previous)
  const sid = await startSignIn(user.id, teamId)
  await replaceUserSession(event, { user: { id: user.id, name: user.name, email: user.email }, teamId, role, loggedInAt: Date.now(), secure: { sid } })
}

/** Signs the caller out here and ends that session on the server. */
export async function signOut(event: H3Event) {
  await clearUserSession(event)
}

/** The guard of every athlete-only route (`/api/me/*`, sessions, entries): coaches get a 403. */
export async function requireAthlete(event: H3Event) {
  const caller = await requireTeamRole(event, 'athlete')
  if (caller.role !== 'athlete') {
    refuse(403, 'This is for athletes; coaches open an athlete from the team page')
  }
  return caller
}
