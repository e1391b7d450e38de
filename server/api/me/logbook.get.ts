import { logbookQuerySchema } from '#shared/schemas/session'

export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const range = queryWith(event, logbookQuerySchema)
  const db = await useDb()
  return { sessions: await loadLogbook(db, caller.teamId, caller.userId, range) }
})
