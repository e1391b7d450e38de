import { and, eq } from 'drizzle-orm'
import { z } from 'zod'
import { idParamsSchema } from '#shared/schemas/common'
import { exercises } from '../../../db/schema'

const archiveSchema = z.object({ archived: z.boolean({ error: 'archived is true or false' }).default(true) })

/** Archiving hides an exercise from the library and the builder; routines and history keep it. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { archived } = await readBodyWith(event, archiveSchema)
  const db = await useDb()
  const { exercise, clip } = await findTeamExercise(db, caller, id)
  const archivedAt = archived ? (exercise.archivedAt ?? new Date()) : null
  const [updated] = await db.update(exercises).set({ archivedAt }).where(and(eq(exercises.id, id), eq(exercises.teamId, caller.teamId))).returning()
  return exerciseView(updated!, clip)
})
