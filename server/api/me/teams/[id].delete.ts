import { idParamsSchema } from '#shared/schemas/common'
import { removeMemberQuerySchema } from '#shared/schemas/team'

/**
 * Leaves one of the caller's teams. The last head coach hands the team over (or deletes it) first.
 * An athlete may ask (`?anonymise=true`) for their records in that team to be anonymised as they go.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { anonymise } = queryWith(event, removeMemberQuerySchema)
  const db = await useDb()
  const mine = await teamsOf(db, caller.userId)
  const team = mine.find(row => row.id === id)
  if (!team) notFound('You are not in that team')
  if (team.role === 'head_coach' && await headCoachCount(db, id, caller.userId) === 0) {
    refuse(409, 'You are this team\'s only head coach: make someone else head coach, or delete the team')
  }
  await endMembership(db, id, caller.userId, { anonymise })
  const next = mine.find(row => row.id !== id)
  if (id === caller.teamId) {
    if (next) await signIn(event, { id: caller.userId, name: caller.name, email: caller.email }, next.id, next.role)
    else await clearUserSession(event)
  }
  return { team: next && id === caller.teamId ? { id: next.id, name: next.name, role: next.role } : null }
})
