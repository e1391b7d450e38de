import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { entryPatchSchema } from '#shared/schemas/session'
import { entryLogs } from '../../db/schema'

/** Corrects a logged set or interval, by its athlete, within the edit window. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, entryPatchSchema)
  const db = await useDb()
  const [entry] = await db.select().from(entryLogs)
    .where(and(eq(entryLogs.id, id), eq(entryLogs.teamId, caller.teamId), eq(entryLogs.athleteId, caller.userId))).limit(1)
  if (!entry) notFound('No such entry')
  const session = await findOwnSession(db, caller, entry.sessionId)
  assertEditable(session)
  const [updated] = await db.update(entryLogs).set(body)
    .where(and(eq(entryLogs.id, entry.id), eq(entryLogs.teamId, caller.teamId))).returning()
  return entryView(updated!)
})
