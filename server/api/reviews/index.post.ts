import { and, eq } from 'drizzle-orm'
import { assignments, formReviews } from '../../db/schema'
import { REVIEW_LIMITS, reviewCreateSchema } from '#shared/schemas/review'

/** The athlete confirms their uploaded clip and sends it for review, with an optional question. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const input = await readBodyWith(event, reviewCreateSchema)
  const db = await useDb()
  if (input.assignmentId) {
    const [own] = await db.select({ id: assignments.id }).from(assignments)
      .where(and(eq(assignments.id, input.assignmentId), eq(assignments.teamId, caller.teamId), eq(assignments.athleteId, caller.userId))).limit(1)
    if (!own) refuseField('assignmentId', 'No such session of yours')
  }
  const clip = await confirmReviewClip(db, caller.teamId, caller.userId, input.key, 'key', REVIEW_LIMITS.clipSeconds)
  const [review] = await db.insert(formReviews).values({
    teamId: caller.teamId,
    athleteId: caller.userId,
    clipId: clip.id,
    question: input.question,
    assignmentId: input.assignmentId ?? null,
    stepId: input.stepId ?? null,
  }).returning()
  setResponseStatus(event, 201)
  return reviewView(db, review!)
})
