import { switchTeamSchema } from '#shared/schemas/team'

/** Switches the team the session is scoped to; only a team the caller belongs to. */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event)
  const { teamId } = await readBodyWith(event, switchTeamSchema)
  const db = await useDb()
  const team = (await teamsOf(db, caller.userId)).find(row => row.id === teamId)
  // The same answer for a team that does not exist and one the caller is not in.
  if (!team) notFound('You are not in that team')
  await signIn(event, { id: caller.userId, name: caller.name, email: caller.email }, team.id, team.role)
  return { team: { id: team.id, name: team.name }, role: team.role }
})
