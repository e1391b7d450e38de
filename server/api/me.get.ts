export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event)
  return {
    user: { id: caller.userId, name: caller.name, email: caller.email, timezone: caller.timezone },
    team: { id: caller.teamId, name: caller.teamName },
    role: caller.role,
  }
})
