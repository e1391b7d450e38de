import { idParamsSchema } from '#shared/schemas/common'
import { profilePatchSchema } from '#shared/schemas/profile'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const patch = await readBodyWith(event, profilePatchSchema)
  const db = await useDb()
  const athlete = await findTeamAthlete(db, caller.teamId, id)
  await saveProfile(db, caller.teamId, athlete.id, patch)
  return loadProfileView(db, caller.teamId, { id: athlete.id, name: athlete.name })
})
