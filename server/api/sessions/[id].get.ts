import { and, asc, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { entryLogs } from '../../db/schema'

/** One session with its entries: the athlete's own, or any of the team's for a coach. */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const session = await findReadableSession(db, caller, id)
  const entries = await db.select().from(entryLogs)
    .where(and(eq(entryLogs.sessionId, session.id), eq(entryLogs.teamId, caller.teamId))).orderBy(asc(entryLogs.id))
  return { ...sessionView(session), entries: entries.map(entryView) }
})
