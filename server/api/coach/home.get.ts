/** The coach's home page in one request. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  return coachHome(db, caller.teamId)
})
