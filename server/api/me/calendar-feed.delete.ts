/** Turns the private feed off. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const db = await useDb()
  await replaceCalendarFeed(db, caller.teamId, caller.userId, { revokeOnly: true })
  setResponseStatus(event, 204)
  return null
})
