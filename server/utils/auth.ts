import type { H3Event } from 'h3'
import { and, eq } from 'drizzle-orm'
import type { Role } from '#shared/types/domain'
import { memberships, teams, users } from '../db/schema'

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
  const session = await getUserSession(event)
  if (!session.user || !session.teamId) {
    refuse(401, 'Sign in first')
  }
  const db = await useDb()
  const [row] = await db.select({
    role: memberships.role,
    name: users.name,
    email: users.email,
    timezone: users.timezone,
    teamName: teams.name,
  }).from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.userId, session.user.id), eq(memberships.teamId, session.teamId)))
    .limit(1)
  if (!row) {
    await clearUserSession(event)
    refuse(401, 'Your membership has ended; sign in again')
  }
  if (!hasRole(row.role, minimum)) {
    refuse(403, minimum === 'athlete' ? 'Not allowed' : 'Only coaches can do this')
  }
  event.context.caller = { userId: session.user.id, teamId: session.teamId, ...row }
  return event.context.caller as Caller
}

export async function requireCoach(event: H3Event) {
  return requireTeamRole(event, 'coach')
}

/** The guard of every athlete-only route (`/api/me/*`, sessions, entries): coaches get a 403. */
export async function requireAthlete(event: H3Event) {
  const caller = await requireTeamRole(event, 'athlete')
  if (caller.role !== 'athlete') {
    refuse(403, 'This is for athletes; coaches open an athlete from the team page')
  }
  return caller
}

/** The role in the session only shapes the client; every route re-reads it from the database. */
export async function signIn(event: H3Event, user: { id: number, name: string, email: string }, teamId: number, role: Role) {
  await replaceUserSession(event, { user: { id: user.id, name: user.name, email: user.email }, teamId, role, loggedInAt: Date.now() })
}
