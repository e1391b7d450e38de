import { painFlagsQuerySchema } from '#shared/schemas/insights'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const query = queryWith(event, painFlagsQuerySchema)
  const db = await useDb()
  if (query.athleteId) await findTeamAthlete(db, caller.teamId, query.athleteId)
  return listPainFlags(db, caller.teamId, { status: query.status === 'all' ? undefined : query.status, athleteId: query.athleteId })
})
