import { and, eq } from 'drizzle-orm'
import { squadPatchSchema } from '#shared/schemas/auth'
import { idParamsSchema } from '#shared/schemas/common'
import { squads } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const input = await readBodyWith(event, squadPatchSchema)
  const db = await useDb()
  const [squad] = await db.update(squads).set(input).where(and(eq(squads.id, id), eq(squads.teamId, caller.teamId))).returning()
  if (!squad) notFound('No such squad')
  return squad
})
