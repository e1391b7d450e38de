import { idParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const athlete = await findTeamAthlete(db, caller.teamId, id)
  return loadProfileView(db, caller.teamId, { id: athlete.id, name: athlete.name })
})
