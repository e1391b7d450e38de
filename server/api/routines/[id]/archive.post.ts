import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { routineArchiveSchema } from '#shared/schemas/routine'
import { routines } from '../../../db/schema'

/** Archiving hides a routine from the list; assignments keep their snapshots. `{ archived: false }` restores it. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { archived } = await readBodyWith(event, routineArchiveSchema)
  const db = await useDb()
  const [row] = await db.update(routines).set({ archivedAt: archived ? new Date() : null })
    .where(and(eq(routines.id, id), eq(routines.teamId, caller.teamId)))
    .returning({ id: routines.id, archivedAt: routines.archivedAt, version: routines.version })
  if (!row) notFound('No such routine')
  return row
})
