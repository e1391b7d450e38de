import { eq, inArray } from 'drizzle-orm'
import { formReviews, mediaObjects } from '../../db/schema'
import { reviewParamsSchema } from '#shared/schemas/review'

/** The athlete deletes their review: the clip (and any reply) leave the store first, then the records. */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const { id } = paramsWith(event, reviewParamsSchema)
  const db = await useDb()
  const review = await findReview(db, caller, id)
  if (review.athleteId !== caller.userId) refuse(403, 'Only the athlete who sent a clip can delete it')
  const mediaIds = [review.clipId, review.replyClipId].filter((value): value is number => value !== null)
  const media = await db.select().from(mediaObjects).where(inArray(mediaObjects.id, mediaIds))
  // With the store down this answers 503 and nothing changes.
  for (const object of media) await deleteObject(object.key)
  await db.transaction(async (tx) => {
    await tx.update(mediaObjects).set({ status: 'deleted' }).where(inArray(mediaObjects.id, mediaIds))
    await tx.delete(formReviews).where(eq(formReviews.id, review.id))
  })
  setResponseStatus(event, 204)
  return null
})
