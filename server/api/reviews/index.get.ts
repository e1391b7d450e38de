import { and, desc, eq, inArray, type SQL } from 'drizzle-orm'
import { formReviews, mediaObjects, squadMembers, users } from '../../db/schema'
import { reviewListQuerySchema, type ReviewSummary } from '#shared/schemas/review'

/** Coaches: the team's review queue, newest first (optionally one squad). Athletes: their own reviews. */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const query = queryWith(event, reviewListQuerySchema)
  const db = await useDb()
  const where: (SQL | undefined)[] = [eq(formReviews.teamId, caller.teamId)]
  if (!isCoachRole(caller.role)) where.push(eq(formReviews.athleteId, caller.userId))
  if (query.status !== 'all') where.push(eq(formReviews.status, query.status))
  if (query.squadId && isCoachRole(caller.role)) {
    const members = db.select({ id: squadMembers.userId }).from(squadMembers).where(eq(squadMembers.squadId, query.squadId))
    where.push(inArray(formReviews.athleteId, members))
  }
  const rows = await db.select({ review: formReviews, athleteName: users.name, durationSeconds: mediaObjects.durationSeconds })
    .from(formReviews)
    .innerJoin(users, eq(users.id, formReviews.athleteId))
    .innerJoin(mediaObjects, eq(mediaObjects.id, formReviews.clipId))
    .where(and(...where))
    .orderBy(desc(formReviews.createdAt), desc(formReviews.id))
    .limit(200)
  const items: ReviewSummary[] = rows.map(({ review, athleteName, durationSeconds }) => ({
    id: review.id,
    athleteId: review.athleteId,
    athleteName,
    question: review.question,
    status: review.status,
    durationSeconds,
    createdAt: review.createdAt.toISOString(),
    answeredAt: review.answeredAt?.toISOString() ?? null,
  }))
  return { items, openCount: items.filter(item => item.status === 'open').length }
})
