import { and, eq, lt } from 'drizzle-orm'
import { mediaObjects } from '../db/schema'

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
