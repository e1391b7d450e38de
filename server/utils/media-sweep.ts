import { and, eq, inArray, lt, sql } from 'drizzle-orm'
import { formReviews, mediaObjects, teams } from '../db/schema'

/**
 * Upload URLs that were handed out but never confirmed: once their URL has long expired, delete whatever
 * the browser may have stored under the key and mark the row deleted, so no object is left orphaned.
 * With the store down nothing is marked, and the next sweep tries again.
 */
export async function sweepAbandonedUploads(now = Date.now()) {
  const db = await useDb()
  const cutoff = new Date(now - 2 * UPLOAD_URL_SECONDS * 1000)
  const stale = await db.select({ id: mediaObjects.id, key: mediaObjects.key }).from(mediaObjects)
    .where(and(eq(mediaObjects.status, 'pending'), lt(mediaObjects.createdAt, cutoff))).limit(100)
  let swept = 0
  for (const row of stale) {
    try {
      await deleteObject(row.key)
    }
    catch {
      break
    }
    await db.update(mediaObjects).set({ status: 'deleted' }).where(and(eq(mediaObjects.id, row.id), eq(mediaObjects.status, 'pending')))
    swept += 1
  }
  return swept
}

/**
 * Form-review clips older than their team's retention (`teams.review_retention_days`, default 180): the
 * clip and any reply leave the store, then the review and its comments. With the store down the review
 * stays, and the next sweep tries again.
 */
export async function sweepExpiredReviews(now = Date.now()) {
  const db = await useDb()
  const expired = await db.select({ id: formReviews.id, clipId: formReviews.clipId, replyClipId: formReviews.replyClipId })
    .from(formReviews).innerJoin(teams, eq(teams.id, formReviews.teamId))
    .where(lt(formReviews.createdAt, sql`${now} - ${teams.reviewRetentionDays} * 86400000`))
    .limit(50)
  let swept = 0
  for (const review of expired) {
    const mediaIds = [review.clipId, review.replyClipId].filter((value): value is number => value !== null)
    const media = await db.select({ key: mediaObjects.key }).from(mediaObjects).where(inArray(mediaObjects.id, mediaIds))
    try {
      for (const object of media) await deleteObject(object.key)
    }
    catch {
      break
    }
    await db.transaction(async (tx) => {
      await tx.update(mediaObjects).set({ status: 'deleted' }).where(inArray(mediaObjects.id, mediaIds))
      await tx.delete(formReviews).where(eq(formReviews.id, review.id))
    })
    swept += 1
  }
  return swept
}
