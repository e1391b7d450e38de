import { idParamsSchema } from '#shared/schemas/common'
import { logbookQuerySchema } from '#shared/schemas/session'

/** A coach reads one of the team's athletes' logs. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const range = queryWith(event, logbookQuerySchema)
  const db = await useDb()
  await findTeamAthlete(db, caller.teamId, id)
  return { sessions: await loadLogbook(db, caller.teamId, id, range) }
})
