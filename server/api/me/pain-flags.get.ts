/** The signed-in athlete's pain flags with the coach's replies, newest first. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const db = await useDb()
  return listPainFlags(db, caller.teamId, { athleteId: caller.userId, limit: 100 })
})
