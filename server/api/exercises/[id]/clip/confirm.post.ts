import { and, eq, inArray } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { clipConfirmSchema } from '#shared/schemas/exercise'
import { exercises, mediaObjects } from '../../../../db/schema'

/**
 * Marks an upload ready once the stored object proves to be what was announced: HEAD for type and
 * size, then its first bytes for the container signature. A mismatch deletes the object.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { key } = await readBodyWith(event, clipConfirmSchema)
  const db = await useDb()
  const { exercise } = await findTeamExercise(db, caller, id)

  if (!key.startsWith(exercisePrefix(caller.teamId, id)) || key.includes('..')) refuseField('key', 'This key is not in this exercise\'s storage')
  const [pending] = await db.select().from(mediaObjects)
    .where(and(eq(mediaObjects.key, key), eq(mediaObjects.teamId, caller.teamId), eq(mediaObjects.exerciseId, id)))
    .limit(1)
  if (!pending) refuseField('key', 'No upload was started with this key')
  if (pending.status === 'ready') refuseField('key', 'This upload is already confirmed')
  if (pending.status === 'deleted') refuseField('key', 'This upload was removed; start a new one')

  const stored = await headObject(key)
  if (!stored) refuseField('key', 'Nothing has been uploaded with this key yet')

  const problem = await uploadProblem(key, stored, pending)
  if (problem) {
    // Nothing half-written: the object goes, and the record says so, before answering.
    await deleteObject(key)
    await db.update(mediaObjects).set({ status: 'deleted' }).where(eq(mediaObjects.id, pending.id))
    refuseField('key', `${problem}; it was discarded`)
  }

  // A clip's length and picture size come from its container, read in place with ranged GETs.
  const metadata = pending.purpose === 'clip' ? await readClipMetadata(key, stored.size) : null
  const replacedId = pending.purpose === 'clip' ? exercise.clipId : exercise.posterId
  const replaced = await db.transaction(async (tx) => {
    await tx.update(mediaObjects).set({
      status: 'ready',
      ...(metadata ? { durationSeconds: metadata.durationSeconds, width: metadata.width, height: metadata.height } : {}),
    }).where(eq(mediaObjects.id, pending.id))
    await tx.update(exercises)
      .set(pending.purpose === 'clip' ? { clipId: pending.id } : { posterId: pending.id })
      .where(and(eq(exercises.id, id), eq(exercises.teamId, caller.teamId)))
    if (!replacedId) return []
    return tx.update(mediaObjects).set({ status: 'deleted' })
      .where(and(inArray(mediaObjects.id, [replacedId]), eq(mediaObjects.teamId, caller.teamId)))
      .returning({ key: mediaObjects.key })
  })
  // The replaced file is no longer referenced; removing it can trail the answer.
  for (const old of replaced) await deleteObjectQuietly(old.key)

  const { exercise: updated, clip } = await findTeamExercise(db, caller, id)
  return exerciseView(updated, clip)
})
