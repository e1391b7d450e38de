import { and, eq } from 'drizzle-orm'
import { formReviews, users } from '../../../db/schema'
import { REVIEW_LIMITS, reviewAnswerSchema, reviewParamsSchema } from '#shared/schemas/review'

/** Marks the review answered (with the coach's reply clip, if one was uploaded) and e-mails the athlete. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, reviewParamsSchema)
  const input = await readBodyWith(event, reviewAnswerSchema)
  const db = await useDb()
  const review = await findReview(db, caller, id)
  const reply = input.replyKey ? await confirmReviewClip(db, caller.teamId, review.athleteId, input.replyKey, 'replyKey', REVIEW_LIMITS.clipSeconds * 5) : null
  const [athlete] = await db.select({ email: users.email, name: users.name, notify: users.notifyByEmail }).from(users).where(eq(users.id, review.athleteId)).limit(1)
  const updated = await db.transaction(async (tx) => {
    const [row] = await tx.update(formReviews).set({
      status: 'answered',
      answeredAt: new Date(),
      answeredById: caller.userId,
      ...(reply ? { replyClipId: reply.id } : {}),
    }).where(and(eq(formReviews.id, review.id), eq(formReviews.teamId, caller.teamId))).returning()
    if (athlete?.notify && review.status !== 'answered') {
      await enqueueEmail(tx, {
        to: athlete.email,
        template: 'review_answered',
        teamId: caller.teamId,
        payload: { athleteName: athlete.name, coachName: caller.name, teamName: caller.teamName, url: `${useServerConfig().appUrl}/reviews/${review.id}` },
      })
    }
    return row!
  })
  return reviewView(db, updated)
})
