import { asc, count, eq } from 'drizzle-orm'
import { squadMembers, squads } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  return db.select({ id: squads.id, name: squads.name, description: squads.description, memberCount: count(squadMembers.userId) })
    .from(squads).leftJoin(squadMembers, eq(squadMembers.squadId, squads.id))
    .where(eq(squads.teamId, caller.teamId)).groupBy(squads.id).orderBy(asc(squads.name))
})
