import { and, eq } from 'drizzle-orm'
import { assignments } from '../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { assignmentPatchSchema } from '#shared/schemas/planner'

/** Moves an assignment to another day and/or changes its note. Work already done stays on its day. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, assignmentPatchSchema)
  const db = await useDb()
  const [assignment] = await db.select().from(assignments).where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId))).limit(1)
  if (!assignment) notFound('No such assignment')
  if (body.date && body.date !== assignment.date && assignment.status !== 'planned') {
    refuseField('date', 'This session has been logged, so it stays on its day', 409)
  }
  const [updated] = await db.update(assignments)
    .set({ ...(body.date ? { date: body.date } : {}), ...(body.note !== undefined ? { note: body.note } : {}) })
    .where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId)))
    .returning({ id: assignments.id, date: assignments.date, note: assignments.note })
  return updated
})
