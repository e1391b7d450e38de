import { and, eq, gte, notExists } from 'drizzle-orm'
import { assignments, sessionLogs } from '../../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { restOfSeriesQuerySchema } from '#shared/schemas/planner'

/**
 * Removes this assignment and the later ones of its series: for this athlete (`?who=athlete`, the default)
 * or for everyone in the series (`?who=all`). Sessions already logged stay.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { who } = queryWith(event, restOfSeriesQuerySchema)
  const db = await useDb()
  const [assignment] = await db.select().from(assignments).where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId))).limit(1)
  if (!assignment) notFound('No such assignment')
  if (!assignment.seriesId) {
    refuseField('id', 'This assignment is not part of a weekly series')
  }
  const removed = await db.transaction(async (tx) => {
    const removed = await tx.delete(assignments).where(and(
      eq(assignments.teamId, caller.teamId),
      eq(assignments.seriesId, assignment.seriesId!),
      gte(assignments.date, assignment.date),
      who === 'athlete' ? eq(assignments.athleteId, assignment.athleteId) : undefined,
      eq(assignments.status, 'planned'),
      notExists(tx.select({ id: sessionLogs.id }).from(sessionLogs).where(eq(sessionLogs.assignmentId, assignments.id))),
    )).returning({ id: assignments.id, athleteId: assignments.athleteId, date: assignments.date })
    // One line per athlete in their notice: how many sessions went, from which day.
    const people = await athletesById(tx, caller.teamId, [...new Set(removed.map(row => row.athleteId))])
    for (const athlete of people) {
      const dates = removed.filter(row => row.athleteId === athlete.id).map(row => row.date).sort()
      await queuePlanChange(tx, { teamId: caller.teamId, teamName: caller.teamName, athlete, change: { kind: 'removed', title: assignment.snapshot.title, from: dates[0], count: dates.length } })
    }
    return removed
  })
  return { removed: removed.length, ids: removed.map(row => row.id) }
})
