import { and, desc, eq } from 'drizzle-orm'
import { assignments, assignmentSeries, routines } from '../../../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { seriesDates, todayIn } from '#shared/utils/dates'

/**
 * Gives athletes who joined the series' squad later (and have no assignment in it) the series'
 * remaining days, from their today on, with the same version of the routine the squad has.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const [series] = await db.select().from(assignmentSeries).where(and(eq(assignmentSeries.id, id), eq(assignmentSeries.teamId, caller.teamId))).limit(1)
  if (!series) notFound('No such series')
  if (!series.squadId) refuseField('id', 'This series was assigned to athletes, not to a squad')

  const [members, existing] = await Promise.all([
    squadAthletes(db, caller.teamId, series.squadId),
    db.selectDistinct({ athleteId: assignments.athleteId }).from(assignments).where(eq(assignments.seriesId, series.id)),
  ])
  const have = new Set(existing.map(row => row.athleteId))
  const newcomers = await athletesById(db, caller.teamId, members.filter(member => !have.has(member)))
  const now = new Date()
  const plan = newcomers
    .map(athlete => ({ athlete, dates: seriesDates(series).filter(day => day >= todayIn(athlete.timezone, now)), note: series.note }))
    .filter(entry => entry.dates.length > 0)
  if (!plan.length) return { added: 0, created: 0, ids: [], athleteIds: [] }

  // Newcomers get what the rest of the squad will do: the latest snapshot in the series.
  const [latest] = await db.select({ snapshot: assignments.snapshot, version: assignments.routineVersion }).from(assignments)
    .where(eq(assignments.seriesId, series.id)).orderBy(desc(assignments.date), desc(assignments.id)).limit(1)
  let routine = { id: series.routineId, version: latest?.version ?? 1 }
  let snapshot = latest?.snapshot
  if (!snapshot) {
    const fresh = await snapshotRoutine(db, caller.teamId, series.routineId)
    routine = { id: fresh.routine.id, version: fresh.routine.version }
    snapshot = fresh.snapshot
  }
  else {
    const [current] = await db.select({ archivedAt: routines.archivedAt }).from(routines).where(eq(routines.id, series.routineId)).limit(1)
    if (current?.archivedAt) refuseField('id', 'This series\' routine is archived; restore it first')
  }

  const ids = await db.transaction(tx => insertBatch(tx, {
    teamId: caller.teamId,
    teamName: caller.teamName,
    coach: { id: caller.userId, name: caller.name },
    routine,
    snapshot: snapshot!,
    seriesId: series.id,
    plan,
  }))
  return { added: plan.length, created: ids.length, ids, athleteIds: plan.map(entry => entry.athlete.id) }
})
