import { and, eq, inArray, isNull } from 'drizzle-orm'
import { assignments, users } from '../../db/schema'
import { refreshRoutineSchema } from '#shared/schemas/planner'
import { todayIn } from '#shared/utils/dates'

/**
 * The explicit "update future assignments to the latest version" action: every still-planned
 * assignment of the routine from each athlete's today on gets a fresh snapshot. Past and logged ones keep theirs.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { routineId } = await readBodyWith(event, refreshRoutineSchema)
  const db = await useDb()
  const { routine, snapshot } = await snapshotRoutine(db, caller.teamId, routineId)
  const candidates = await db.select({ id: assignments.id, date: assignments.date, timezone: users.timezone })
    .from(assignments).innerJoin(users, eq(users.id, assignments.athleteId))
    // Block sessions carry their week's numbers; re-planning the block brings them the routine's latest version.
    .where(and(eq(assignments.teamId, caller.teamId), eq(assignments.routineId, routine.id), eq(assignments.status, 'planned'), isNull(assignments.blockId)))
  const now = new Date()
  const ids = candidates.filter(row => row.date >= todayIn(row.timezone, now)).map(row => row.id)
  await db.transaction(async (tx) => {
    for (let start = 0; start < ids.length; start += 500) {
      await tx.update(assignments)
        .set({ snapshot, routineVersion: routine.version })
        .where(and(eq(assignments.teamId, caller.teamId), inArray(assignments.id, ids.slice(start, start + 500))))
    }
  })
  return { updated: ids.length, version: routine.version }
})
