import { and, asc, eq } from 'drizzle-orm'
import { memberships, squadMembers, squads, users } from '../../db/schema'

/** The team's athletes with their squads, for pickers and rosters. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  const [athletes, links] = await Promise.all([
    db.select({ id: users.id, name: users.name, email: users.email })
      .from(memberships).innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, caller.teamId), eq(memberships.role, 'athlete'))).orderBy(asc(users.name)),
    db.select({ squadId: squadMembers.squadId, userId: squadMembers.userId })
      .from(squadMembers).innerJoin(squads, eq(squads.id, squadMembers.squadId)).where(eq(squads.teamId, caller.teamId)),
  ])
  return athletes.map(athlete => ({ ...athlete, squadIds: links.filter(link => link.userId === athlete.id).map(link => link.squadId) }))
})
