import { and, asc, count, eq, gte, inArray, isNull, or, sql } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { todayIn } from '#shared/utils/dates'
import { assignments, routineExercises, routines, users } from '../../../db/schema'

const UPCOMING_LIMIT = 100

/** Where an exercise is used: the team's live routines, and upcoming assignments that include it. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  await findTeamExercise(db, caller, id)

  const usedIn = await db.select({ id: routines.id, title: routines.title, category: routines.category, version: routines.version })
    .from(routineExercises)
    .innerJoin(routines, eq(routines.id, routineExercises.routineId))
    .where(and(eq(routineExercises.exerciseId, id), eq(routines.teamId, caller.teamId), isNull(routines.archivedAt)))
    .orderBy(asc(sql`lower(${routines.title})`))

  const today = todayIn(caller.timezone)
  const routineIds = usedIn.map(routine => routine.id)
  const matches = and(
    eq(assignments.teamId, caller.teamId),
    gte(assignments.date, today),
    or(routineIds.length ? inArray(assignments.routineId, routineIds) : undefined, snapshotUsesExercise(id)),
  )
  const athleteName = shownAthleteName(caller.teamId, assignments.athleteId)
  const [upcoming, [totals]] = await Promise.all([
    db.select({
      id: assignments.id,
      date: assignments.date,
      status: assignments.status,
      routineId: assignments.routineId,
      title: sql<string>`json_extract(${assignments.snapshot}, '$.title')`,
      athleteId: assignments.athleteId,
      athleteName,
    }).from(assignments)
      .innerJoin(users, eq(users.id, assignments.athleteId))
      .where(matches)
      .orderBy(asc(assignments.date), asc(athleteName), asc(assignments.id))
      .limit(UPCOMING_LIMIT),
    db.select({ total: count() }).from(assignments).where(matches),
  ])

  return {
    routines: usedIn,
    assignments: upcoming,
    assignmentTotal: totals?.total ?? 0,
    since: today,
  }
})
