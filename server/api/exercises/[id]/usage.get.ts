import { and, asc, eq, isNull, sql } from 'drizzle-orm'
import { idParamsSchema } from '../../../../shared/schemas/common'
import { todayIn } from '../../../../shared/utils/dates'
import { routineExercises, routines } from '../../../db/schema'

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
  const inRoutines = routineIds.length ? sql`a.routine_id IN (${sql.join(routineIds.map(routineId => sql`${routineId}`), sql`, `)})` : sql`0`
  const matches = sql`a.team_id = ${caller.teamId} AND a.date >= ${today} AND (
      ${inRoutines}
      OR EXISTS (SELECT 1 FROM json_each(a.snapshot, '$.exercises') e WHERE json_extract(e.value, '$.id') = ${id})
      OR EXISTS (SELECT 1 FROM json_tree(a.snapshot, '$.steps') t WHERE t.key = 'exerciseId' AND t.value = ${id}))`
  const [upcoming, [totals]] = await Promise.all([
    db.all<{ id: number, date: string, status: string, routineId: number, title: string, athleteId: number, athleteName: string }>(sql`
      SELECT a.id, a.date, a.status, a.routine_id AS routineId, json_extract(a.snapshot, '$.title') AS title,
             a.athlete_id AS athleteId, u.name AS athleteName
        FROM assignments a JOIN users u ON u.id = a.athlete_id
       WHERE ${matches}
       ORDER BY a.date, u.name, a.id
       LIMIT ${UPCOMING_LIMIT}`),
    db.all<{ total: number }>(sql`SELECT count(*) AS total FROM assignments a WHERE ${matches}`),
  ])

  return {
    routines: usedIn,
    assignments: upcoming.map(row => ({ ...row, id: Number(row.id), routineId: Number(row.routineId), athleteId: Number(row.athleteId) })),
    assignmentTotal: Number(totals?.total ?? 0),
    since: today,
  }
})
