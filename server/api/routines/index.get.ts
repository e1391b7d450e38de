import { and, desc, eq, isNotNull, isNull, sql } from 'drizzle-orm'
import { routineListQuerySchema } from '#shared/schemas/routine'
import { buildTimeline } from '#shared/utils/timeline'
import { routines } from '../../db/schema'

/** The team's routines, newest edit first, with their totals for the list. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const query = queryWith(event, routineListQuerySchema)
  const db = await useDb()
  const conditions = [eq(routines.teamId, caller.teamId), query.archived ? isNotNull(routines.archivedAt) : isNull(routines.archivedAt)]
  if (query.category) conditions.push(eq(routines.category, query.category))
  if (query.q) {
    const pattern = `%${query.q.toLowerCase().replace(/[\\%_]/g, match => `\\${match}`)}%`
    conditions.push(sql`(lower(${routines.title}) like ${pattern} escape '\\' or lower(${routines.description}) like ${pattern} escape '\\')`)
  }
  const rows = await db.select().from(routines).where(and(...conditions)).orderBy(desc(routines.updatedAt), desc(routines.id))
  const items = rows.map((routine) => {
    const { totals } = buildTimeline(routine.steps)
    return {
      id: routine.id,
      title: routine.title,
      category: routine.category,
      description: routine.description,
      version: routine.version,
      isTemplate: routine.isTemplate,
      isStarter: routine.starterKey !== null,
      archivedAt: routine.archivedAt,
      updatedAt: routine.updatedAt,
      stepCount: routine.steps.length,
      totals,
    }
  })
  return { items, total: items.length }
})
