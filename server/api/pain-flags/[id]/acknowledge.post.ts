import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '../../../../shared/schemas/common'
import { acknowledgePainFlagSchema } from '../../../../shared/schemas/insights'
import { painFlags } from '../../../db/schema'

/** Marks a flag as seen, with an optional reply the athlete reads on their progress page. Repeating it updates the reply. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { reply } = await readBodyWith(event, acknowledgePainFlagSchema)
  const db = await useDb()
  const [updated] = await db.update(painFlags)
    .set({ status: 'acknowledged', reply: reply || null, acknowledgedById: caller.userId, acknowledgedAt: new Date() })
    .where(and(eq(painFlags.id, id), eq(painFlags.teamId, caller.teamId)))
    .returning({ id: painFlags.id })
  if (!updated) notFound('No such pain flag')
  const [flag] = await listPainFlags(db, caller.teamId, { id })
  return flag
})
