import { and, eq, inArray } from 'drizzle-orm'
import type { Database } from '../db/client'
import { memberships, squads, users } from '../db/schema'

/** The team's athletes among `ids`; a 400 naming the field when any is not an athlete of this team. */
export async function assertTeamAthletes(db: Database, teamId: number, ids: number[], field = 'athleteIds') {
  if (ids.length === 0) return []
  const rows = await db.select({ id: users.id, name: users.name, email: users.email, notifyByEmail: users.notifyByEmail, timezone: users.timezone })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId), eq(memberships.role, 'athlete')))
    .where(inArray(users.id, ids))
  if (rows.length !== new Set(ids).size) {
    refuseField(field, 'One or more athletes are not in your team')
  }
  return rows
}

export async function findTeamSquad(db: Database, teamId: number, squadId: number) {
  const [squad] = await db.select().from(squads).where(and(eq(squads.id, squadId), eq(squads.teamId, teamId))).limit(1)
  if (!squad) notFound('No such squad')
  return squad
}
