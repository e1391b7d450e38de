import { randomBytes } from 'node:crypto'
import { and, asc, eq } from 'drizzle-orm'
import type { Database } from '../db/client'
import { exercises, formReviewComments, formReviews, mediaObjects, users } from '../db/schema'
import { mediaExtensions } from '#shared/schemas/exercise'
import type { ReviewView } from '#shared/schemas/review'
import type { Caller } from './auth'

export function reviewPrefix(teamId: number, athleteId: number) {
  return `teams/${teamId}/reviews/${athleteId}/`
}

export function newReviewKey(teamId: number, athleteId: number, contentType: string) {
  return `${reviewPrefix(teamId, athleteId)}${randomBytes(12).toString('hex')}.${mediaExtensions[contentType] ?? 'bin'}`
}

/**
 * The review, if the caller may see it: the athlete who sent it and the team's coaches. Everyone else
 * (another athlete, another team) gets the same 404 as for an id that does not exist.
 */
export async function findReview(db: Database, caller: Caller, id: number) {
  const [review] = await db.select().from(formReviews)
    .where(and(eq(formReviews.id, id), eq(formReviews.teamId, caller.teamId))).limit(1)
  if (!review) notFound('No such review')
  if (!isCoachRole(caller.role) && review.athleteId !== caller.userId) notFound('No such review')
  return review
}

/**
 * Checks an uploaded review clip (under the athlete's prefix, pending, stored as announced, a real video of
 * at most `maxSeconds`) and marks it ready; anything wrong deletes the object and answers 400 on `field`.
 */
export async function confirmReviewClip(db: Database, teamId: number, athleteId: number, key: string, field: string, maxSeconds: number) {
  if (!key.startsWith(reviewPrefix(teamId, athleteId)) || key.includes('..')) refuseField(field, 'This key is not in this athlete\'s review storage')
  const [pending] = await db.select().from(mediaObjects)
    .where(and(eq(mediaObjects.key, key), eq(mediaObjects.teamId, teamId))).limit(1)
  if (!pending || pending.exerciseId !== null) refuseField(field, 'No upload was started with this key')
  if (pending.status !== 'pending') refuseField(field, 'This upload was already used or removed; start a new one')
  const stored = await headObject(key)
  if (!stored) refuseField(field, 'Nothing has been uploaded with this key yet')
  let problem = await uploadProblem(key, stored, pending)
  const metadata = problem ? null : await readClipMetadata(key, stored.size)
  if (metadata?.durationSeconds && metadata.durationSeconds > maxSeconds + 0.5) problem = `The clip is ${Math.round(metadata.durationSeconds)} s long; send at most ${maxSeconds} s`
  if (problem) {
    await deleteObject(key)
    await db.update(mediaObjects).set({ status: 'deleted' }).where(eq(mediaObjects.id, pending.id))
    refuseField(field, `${problem}; it was discarded`)
  }
  await db.update(mediaObjects).set({ status: 'ready', durationSeconds: metadata!.durationSeconds, width: metadata!.width, height: metadata!.height })
    .where(eq(mediaObjects.id, pending.id))
  return { ...pending, durationSeconds: metadata!.durationSeconds, width: metadata!.width, height: metadata!.height }
}

/** Everything the review screen shows, with short-lived URLs for the clip and the reply. */
export async function reviewView(db: Database, review: typeof formReviews.$inferSelect): Promise<ReviewView> {
  const [athlete] = await db.select({ name: users.name }).from(users).where(eq(users.id, review.athleteId)).limit(1)
  const [clip] = await db.select().from(mediaObjects).where(eq(mediaObjects.id, review.clipId)).limit(1)
  const reply = review.replyClipId ? (await db.select().from(mediaObjects).where(eq(mediaObjects.id, review.replyClipId)).limit(1))[0] : undefined
  const exercise = review.exerciseId
    ? (await db.select({ id: exercises.id, name: exercises.name, cues: exercises.cues }).from(exercises).where(eq(exercises.id, review.exerciseId)).limit(1))[0]
    : undefined
  const comments = await db.select({ id: formReviewComments.id, atSeconds: formReviewComments.atSeconds, text: formReviewComments.text, authorName: users.name, createdAt: formReviewComments.createdAt })
    .from(formReviewComments).leftJoin(users, eq(users.id, formReviewComments.authorId))
    .where(eq(formReviewComments.reviewId, review.id))
    .orderBy(asc(formReviewComments.atSeconds), asc(formReviewComments.id))
  return {
    id: review.id,
    athleteId: review.athleteId,
    athleteName: athlete?.name ?? '',
    question: review.question,
    status: review.status,
    durationSeconds: clip?.durationSeconds ?? null,
    createdAt: review.createdAt.toISOString(),
    answeredAt: review.answeredAt?.toISOString() ?? null,
    clip: { url: (await presignPlayback(clip!.key)).url, contentType: clip!.contentType, width: clip!.width, height: clip!.height },
    reply: reply && reply.status === 'ready' ? { url: (await presignPlayback(reply.key)).url, contentType: reply.contentType } : null,
    exercise: exercise ?? null,
    comments: comments.map(comment => ({ ...comment, createdAt: comment.createdAt.toISOString() })),
    assignmentId: review.assignmentId,
    stepId: review.stepId,
  }
}
