import { mediaObjects } from '../../db/schema'
import { reviewUploadRequestSchema } from '#shared/schemas/review'

/** A presigned PUT for an athlete's own review clip, under their own prefix; type and size are signed. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const input = await readBodyWith(event, reviewUploadRequestSchema)
  await assertStorageReachable()
  const db = await useDb()
  const key = newReviewKey(caller.teamId, caller.userId, input.contentType)
  const signed = await presignUpload(key, input.contentType, input.size)
  await db.insert(mediaObjects).values({ teamId: caller.teamId, exerciseId: null, key, purpose: 'clip', contentType: input.contentType, size: input.size, status: 'pending', createdById: caller.userId })
  return { url: signed.url, key, expiresAt: signed.expiresAt, method: 'PUT', headers: { 'content-type': input.contentType } }
})
