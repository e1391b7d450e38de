import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { injuryNotePatchSchema } from '#shared/schemas/profile'
import { injuryNotes } from '../../db/schema'

/** The athlete edits or resolves their own note; their coaches may too. */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, injuryNotePatchSchema)
  const db = await useDb()
  const conditions = [eq(injuryNotes.id, id), eq(injuryNotes.teamId, caller.teamId)]
  if (!isCoachRole(caller.role)) conditions.push(eq(injuryNotes.athleteId, caller.userId))
  const [updated] = await db.update(injuryNotes).set(body).where(and(...conditions)).returning()
  if (!updated) notFound('No such injury note')
  return updated
})
