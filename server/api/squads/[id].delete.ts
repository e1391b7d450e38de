import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { squads } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const deleted = await db.delete(squads).where(and(eq(squads.id, id), eq(squads.teamId, caller.teamId))).returning({ id: squads.id })
  if (deleted.length === 0) notFound('No such squad')
  setResponseStatus(event, 204)
  return null
})
