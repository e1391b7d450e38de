export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const db = await useDb()
  return loadProfileView(db, caller.teamId, { id: caller.userId, name: caller.name })
})
