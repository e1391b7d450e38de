import { and, eq } from 'drizzle-orm'
import { formReviews } from '../../db/schema'
import { reviewParamsSchema, reviewPatchSchema } from '#shared/schemas/review'

/** The coach links a library exercise (its cues open beside the clip), or unlinks it with null. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, reviewParamsSchema)
  const input = await readBodyWith(event, reviewPatchSchema)
  const db = await useDb()
  const review = await findReview(db, caller, id)
  if (input.exerciseId !== null) {
    try {
      await findTeamExercise(db, caller, input.exerciseId)
    }
    catch {
      refuseField('exerciseId', 'No such exercise in your library')
    }
  }
  const [updated] = await db.update(formReviews).set({ exerciseId: input.exerciseId })
    .where(and(eq(formReviews.id, review.id), eq(formReviews.teamId, caller.teamId))).returning()
  return reviewView(db, updated!)
})
