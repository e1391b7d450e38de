import { eq } from 'drizzle-orm'
import { formReviewComments, mediaObjects } from '../../../db/schema'
import { reviewCommentSchema, reviewParamsSchema } from '#shared/schemas/review'

/** A coach's comment pinned to a moment of the athlete's clip. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, reviewParamsSchema)
  const input = await readBodyWith(event, reviewCommentSchema)
  const db = await useDb()
  const review = await findReview(db, caller, id)
  const [clip] = await db.select({ durationSeconds: mediaObjects.durationSeconds }).from(mediaObjects).where(eq(mediaObjects.id, review.clipId)).limit(1)
  const limit = clip?.durationSeconds ?? 60
  if (input.atSeconds > limit) refuseField('atSeconds', `The moment is past the end of the clip (${limit.toFixed(1)} s)`)
  await db.insert(formReviewComments).values({ teamId: caller.teamId, reviewId: review.id, authorId: caller.userId, atSeconds: input.atSeconds, text: input.text })
  setResponseStatus(event, 201)
  return reviewView(db, review)
})
