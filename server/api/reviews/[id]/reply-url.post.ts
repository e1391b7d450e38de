import { mediaObjects } from '../../../db/schema'
import { reviewParamsSchema, reviewUploadRequestSchema } from '#shared/schemas/review'

/** A presigned PUT for the coach's reply clip, stored under the athlete's review prefix. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, reviewParamsSchema)
  const input = await readBodyWith(event, reviewUploadRequestSchema)
  const db = await useDb()
  const review = await findReview(db, caller, id)
  await assertStorageReachable()
  const key = newReviewKey(caller.teamId, review.athleteId, input.contentType)
  const signed = await presignUpload(key, input.contentType, input.size)
  await db.insert(mediaObjects).values({ teamId: caller.teamId, exerciseId: null, key, purpose: 'clip', contentType: input.contentType, size: input.size, status: 'pending', createdById: caller.userId })
  return { url: signed.url, key, expiresAt: signed.expiresAt, method: 'PUT', headers: { 'content-type': input.contentType } }
})
