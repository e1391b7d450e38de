import { profilePatchSchema } from '#shared/schemas/profile'

export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const patch = await readBodyWith(event, profilePatchSchema)
  const db = await useDb()
  await saveProfile(db, caller.teamId, caller.userId, patch)
  return loadProfileView(db, caller.teamId, { id: caller.userId, name: caller.name })
})
