import { and, eq, inArray } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { clipDeleteQuerySchema } from '#shared/schemas/exercise'
import { exercises, mediaObjects } from '../../../../db/schema'

/** Removes the clip (and its poster, unless only one of them is named): storage first, then the record. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { purpose } = queryWith(event, clipDeleteQuerySchema)
  const db = await useDb()
  const { exercise } = await findTeamExercise(db, caller, id)

  const mediaIds = [
    purpose !== 'poster' ? exercise.clipId : null,
    purpose !== 'clip' ? exercise.posterId : null,
  ].filter((value): value is number => value !== null)
  if (!mediaIds.length) notFound(purpose === 'poster' ? 'This exercise has no poster' : 'This exercise has no clip')

  const media = await db.select().from(mediaObjects).where(and(inArray(mediaObjects.id, mediaIds), eq(mediaObjects.teamId, caller.teamId)))
  // If the store is down this answers 503 and nothing changes, so no record points at a deleted file.
  for (const object of media) await deleteObject(object.key)

  await db.transaction(async (tx) => {
    await tx.update(mediaObjects).set({ status: 'deleted' }).where(inArray(mediaObjects.id, mediaIds))
    await tx.update(exercises).set({
      ...(purpose !== 'poster' ? { clipId: null } : {}),
      ...(purpose !== 'clip' ? { posterId: null } : {}),
    }).where(and(eq(exercises.id, id), eq(exercises.teamId, caller.teamId)))
  })
  const { exercise: updated, clip } = await findTeamExercise(db, caller, id)
  return exerciseView(updated, clip)
})
