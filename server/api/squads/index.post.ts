import { squadSchema } from '#shared/schemas/auth'
import { squads } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const input = await readBodyWith(event, squadSchema)
  const db = await useDb()
  const [squad] = await db.insert(squads).values({ teamId: caller.teamId, ...input }).returning()
  setResponseStatus(event, 201)
  return squad
})
