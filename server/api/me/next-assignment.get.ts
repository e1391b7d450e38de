import { and, asc, desc, eq, gte, lt } from 'drizzle-orm'
import { z } from 'zod'
import { idParam } from '#shared/schemas/common'
import { todayIn } from '#shared/utils/dates'
import { assignments } from '../../db/schema'

const querySchema = z.object({ routineId: idParam })

/** The caller's next planned assignment of a routine (today or later; else the latest missed one). */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { routineId } = queryWith(event, querySchema)
  const db = await useDb()
  const today = todayIn(caller.timezone)
  const mine = and(eq(assignments.teamId, caller.teamId), eq(assignments.athleteId, caller.userId), eq(assignments.routineId, routineId), eq(assignments.status, 'planned'))
  const [upcoming] = await db.select({ id: assignments.id, date: assignments.date }).from(assignments)
    .where(and(mine, gte(assignments.date, today))).orderBy(asc(assignments.date)).limit(1)
  const [missed] = upcoming
    ? []
    : await db.select({ id: assignments.id, date: assignments.date }).from(assignments)
        .where(and(mine, lt(assignments.date, today))).orderBy(desc(assignments.date)).limit(1)
  const found = upcoming ?? missed
  if (!found) notFound('No planned session of this routine')
  return found
})
