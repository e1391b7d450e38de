import { teamInsightsQuerySchema } from '#shared/schemas/insights'
import { RATIO_BAND } from '#shared/utils/insights'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const query = queryWith(event, teamInsightsQuerySchema)
  return keptAnswer(event, caller, async () => {
    const db = await useDb()
    // A squad that is not the team's is a 404, never kept; removing one is a write, which ends what was kept.
    if (query.squadId) await findTeamSquad(db, caller.teamId, query.squadId)
    const rows = sortTeamRows(await teamInsightsRows(db, caller.teamId, query.squadId), query.sort)
    const pages = Math.max(1, Math.ceil(rows.length / query.pageSize))
    const page = Math.min(query.page, pages)
    return {
      rows: rows.slice((page - 1) * query.pageSize, page * query.pageSize),
      total: rows.length,
      page,
      pages,
      pageSize: query.pageSize,
      sort: query.sort,
      squadId: query.squadId ?? null,
      band: RATIO_BAND,
    }
  })
})
