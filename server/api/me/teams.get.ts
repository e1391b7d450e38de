/** The teams the caller belongs to, for the team switcher; `active` is the one requests are scoped to. */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event)
  const db = await useDb()
  const rows = await teamsOf(db, caller.userId)
  return rows.map(team => ({ ...team, active: team.id === caller.teamId }))
})
