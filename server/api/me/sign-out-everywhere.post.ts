// Ends every session of the caller, this one included.
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event)
  const ended = await endAllSignIns(caller.userId)
  await clearUserSession(event)
  return { ok: true, endedSessions: ended }
})
