import { and, asc, eq, gte, inArray, lte } from 'drizzle-orm'
import { assignments, assignmentSeries, memberships, routines, users } from '../../db/schema'
import { assignmentRangeSchema } from '#shared/schemas/planner'
import { shownStatus } from '#shared/utils/assignment-status'
import { todayIn } from '#shared/utils/dates'

/** The team's plan between two days, optionally for one athlete or the current members of one squad. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const query = queryWith(event, assignmentRangeSchema)
  const db = await useDb()

  const filters = [eq(assignments.teamId, caller.teamId), gte(assignments.date, query.from), lte(assignments.date, query.to)]
  if (query.athleteId) {
    const [member] = await db.select({ id: memberships.id }).from(memberships)
      .where(and(eq(memberships.teamId, caller.teamId), eq(memberships.userId, query.athleteId), eq(memberships.role, 'athlete'))).limit(1)
    if (!member) notFound('No such athlete')
    filters.push(eq(assignments.athleteId, query.athleteId))
  }
  if (query.squadId) {
    await findTeamSquad(db, caller.teamId, query.squadId)
    const members = await squadAthletes(db, caller.teamId, query.squadId)
    filters.push(inArray(assignments.athleteId, members))
  }

  const athleteName = shownAthleteName(caller.teamId, assignments.athleteId)
  const rows = await db.select({
    id: assignments.id,
    date: assignments.date,
    athleteId: assignments.athleteId,
    athleteName,
    timezone: users.timezone,
    routineId: assignments.routineId,
    routineVersion: assignments.routineVersion,
    latestVersion: routines.version,
    snapshot: assignments.snapshot,
    seriesId: assignments.seriesId,
    seriesSquadId: assignmentSeries.squadId,
    note: assignments.note,
    status: assignments.status,
  }).from(assignments)
    .innerJoin(users, eq(users.id, assignments.athleteId))
    .innerJoin(routines, eq(routines.id, assignments.routineId))
    .leftJoin(assignmentSeries, eq(assignmentSeries.id, assignments.seriesId))
    .where(and(...filters))
    .orderBy(asc(assignments.date), asc(athleteName), asc(assignments.id))

  const now = new Date()
  return {
    from: query.from,
    to: query.to,
    assignments: rows.map(({ snapshot, timezone, ...row }) => ({
      ...row,
      title: snapshot.title,
      category: snapshot.category,
      shownStatus: shownStatus(row.status, row.date, todayIn(timezone, now)),
    })),
  }
})
