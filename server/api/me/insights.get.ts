import { athleteInsightsQuerySchema } from '#shared/schemas/insights'

/** The signed-in athlete's own insights (the same payload a coach sees for them). */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { weeks } = queryWith(event, athleteInsightsQuerySchema)
  const db = await useDb()
  const insights = await athleteInsights(db, caller.teamId, caller.userId, weeks)
  if (!insights) notFound('Insights are for athletes')
  return insights
})
