/** A new private feed address; the previous one stops working at once. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const db = await useDb()
  const feed = await replaceCalendarFeed(db, caller.teamId, caller.userId)
  setResponseStatus(event, 201)
  return feed
})
