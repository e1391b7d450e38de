import { idParamsSchema } from '#shared/schemas/common'
import { athleteInsightsQuerySchema } from '#shared/schemas/insights'

// Coaches see any athlete of their team; an athlete sees only their own page. Anything else is a 404.
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const { id } = paramsWith(event, idParamsSchema)
  const { weeks } = queryWith(event, athleteInsightsQuerySchema)
  if (!isCoachRole(caller.role) && id !== caller.userId) notFound('No such athlete')
  const db = await useDb()
  const insights = await athleteInsights(db, caller.teamId, id, weeks)
  if (!insights) notFound('No such athlete')
  return insights
})
