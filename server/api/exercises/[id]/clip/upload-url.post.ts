import { idParamsSchema } from '#shared/schemas/common'
import { clipUploadRequestSchema } from '#shared/schemas/exercise'
import { mediaObjects } from '../../../../db/schema'

/**
 * A presigned PUT for a clip or poster: the key sits under the team's own prefix, and the signature
 * fixes the content type and exact size, so the store refuses any other file on that URL.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const input = await readBodyWith(event, clipUploadRequestSchema)
  const db = await useDb()
  await findTeamExercise(db, caller, id)
  await assertStorageReachable()

  const key = newExerciseKey(caller.teamId, id, input.contentType)
  const signed = await presignUpload(key, input.contentType, input.size)
  await db.insert(mediaObjects).values({
    teamId: caller.teamId,
    exerciseId: id,
    key,
    purpose: input.purpose,
    contentType: input.contentType,
    size: input.size,
    status: 'pending',
    createdById: caller.userId,
  })
  return { url: signed.url, key, expiresAt: signed.expiresAt, method: 'PUT', headers: { 'content-type': input.contentType } }
})
