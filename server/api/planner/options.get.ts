import { and, asc, eq, isNull } from 'drizzle-orm'
import { routines } from '../../db/schema'

/** What the planner's pickers offer: the team's routines that can be assigned, athletes and squads. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  const [routineRows, athletes, squads] = await Promise.all([
    db.select({ id: routines.id, title: routines.title, category: routines.category, version: routines.version })
      .from(routines).where(and(eq(routines.teamId, caller.teamId), isNull(routines.archivedAt))).orderBy(asc(routines.title)),
    teamAthletesWithSquads(db, caller.teamId),
    teamSquads(db, caller.teamId),
  ])
  return { routines: routineRows, athletes, squads }
})
