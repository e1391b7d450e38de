import { reviewParamsSchema } from '#shared/schemas/review'

export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const { id } = paramsWith(event, reviewParamsSchema)
  const db = await useDb()
  const review = await findReview(db, caller, id)
  setResponseHeader(event, 'cache-control', 'private, no-store')
  return reviewView(db, review)
})
