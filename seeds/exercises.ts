import { randomBytes } from 'node:crypto'
import { HeadBucketCommand, PutObjectCommand } from '@aws-sdk/client-s3'
import { and, eq, sql } from 'drizzle-orm'
import { clipCues, exercises, mediaObjects } from '../server/db/schema'
import { starterExercises, starterSlug } from '../server/starter/exercises'
import { createObjectStoreClient, objectStoreSettingsFromEnv } from '../server/utils/object-store-client'
import { CLIP_CUE_LIMITS } from '../shared/schemas/clip-cue'
import type { SeedStep } from './context'
import { figureStyles } from './figure'
import { renderFigureClip } from './figure-clip'
import { exerciseMovements } from './movements'

export function seedStorage() {
  const settings = objectStoreSettingsFromEnv()
  return {
    bucket: settings.bucket,
    endpoint: settings.endpoint,
    client: createObjectStoreClient(settings, { maxAttempts: 1, connectionTimeoutMs: 2000, requestTimeoutMs: 10_000 }),
  }
}

/** The starter library (idempotent by team and name) and a demo figure clip, with cues at their moments, for every exercise. */
export const seedExercises: SeedStep = async ({ db, teamId, users, log }) => {
  let created = 0
  const ids = new Map<string, number>()
  for (const { clip: _clip, ...exercise } of starterExercises) {
    const [existing] = await db.select({ id: exercises.id }).from(exercises)
      .where(and(eq(exercises.teamId, teamId), sql`lower(${exercises.name}) = lower(${exercise.name})`)).limit(1)
    if (existing) {
      ids.set(exercise.name, existing.id)
      continue
    }
    const [row] = await db.insert(exercises).values({ ...exercise, teamId, starterKey: starterSlug(exercise.name), createdById: users.headCoach }).returning({ id: exercises.id })
    ids.set(exercise.name, row!.id)
    created += 1
  }
  log(`exercises: ${starterExercises.length} in the starter library (${created} new)`)

  const { client, bucket, endpoint } = seedStorage()
  try {
    await client.send(new HeadBucketCommand({ Bucket: bucket }))
  }
  catch (error) {
    console.warn(`  warning: the object store (${endpoint}, bucket ${bucket}) cannot be reached, so demo clips were skipped: ${(error as Error).message || (error as Error).name}`)
    client.destroy()
    return
  }
  const started = performance.now()
  let uploaded = 0
  let drawn = 0
  for (const exercise of starterExercises) {
    const id = ids.get(exercise.name)!
    const motion = exerciseMovements[exercise.name]
    if (!motion) continue
    const [current] = await db.select({ clipId: exercises.clipId, durationSeconds: mediaObjects.durationSeconds, contentType: mediaObjects.contentType, createdById: mediaObjects.createdById })
      .from(exercises).leftJoin(mediaObjects, eq(mediaObjects.id, exercises.clipId)).where(eq(exercises.id, id)).limit(1)
    // A coach's own clip is kept; only a missing clip or the earlier demo placeholder (no length read) is drawn.
    const placeholder = current?.clipId && current.durationSeconds === null && current.contentType === 'video/webm' && current.createdById === users.headCoach
    if (current?.clipId && !placeholder) continue

    const clip = await renderFigureClip(motion.movement, figureStyles[exercise.category]!)
    if (!clip.fromCache) drawn += 1
    const prefix = `teams/${teamId}/exercises/${id}/${randomBytes(12).toString('hex')}`
    await client.send(new PutObjectCommand({ Bucket: bucket, Key: `${prefix}.webm`, Body: clip.webm, ContentType: 'video/webm', ContentLength: clip.webm.byteLength }))
    await client.send(new PutObjectCommand({ Bucket: bucket, Key: `${prefix}.jpg`, Body: clip.poster, ContentType: 'image/jpeg', ContentLength: clip.poster.byteLength }))
    await db.transaction(async (tx) => {
      const [media] = await tx.insert(mediaObjects).values({ teamId, exerciseId: id, key: `${prefix}.webm`, purpose: 'clip', contentType: 'video/webm', size: clip.webm.byteLength, durationSeconds: clip.durationSeconds, width: clip.width, height: clip.height, status: 'ready', createdById: users.headCoach }).returning({ id: mediaObjects.id })
      const [poster] = await tx.insert(mediaObjects).values({ teamId, exerciseId: id, key: `${prefix}.jpg`, purpose: 'poster', contentType: 'image/jpeg', size: clip.poster.byteLength, status: 'ready', createdById: users.headCoach }).returning({ id: mediaObjects.id })
      await tx.update(exercises).set({ clipId: media!.id, posterId: poster!.id }).where(eq(exercises.id, id))
      if (placeholder) await tx.update(mediaObjects).set({ status: 'deleted' }).where(eq(mediaObjects.id, current.clipId!))
      const [existingCue] = await tx.select({ id: clipCues.id }).from(clipCues).where(eq(clipCues.exerciseId, id)).limit(1)
      if (!existingCue) {
        const cues = demoCues(exercise.cues, clip.durationSeconds, motion.cueAt)
        if (cues.length) await tx.insert(clipCues).values(cues.map(cue => ({ ...cue, teamId, exerciseId: id, createdById: users.headCoach })))
      }
    })
    uploaded += 1
  }
  client.destroy()
  log(`exercise clips: ${uploaded} demo figure clips uploaded (${drawn} drawn, the rest from .data/clip-cache) in ${((performance.now() - started) / 1000).toFixed(1)} s`)
}

/** The exercise's cues at their moments in the clip: given times, or spread evenly, each up until the next. */
export function demoCues(cues: string[], durationSeconds: number, cueAt?: number[]) {
  const list = cues.slice(0, CLIP_CUE_LIMITS.perClip)
  const starts = list.map((_, index) => cueAt?.[index] ?? Math.round((index * durationSeconds / Math.max(1, list.length)) * 10) / 10 + 0.1)
  return list.map((text, index) => {
    const next = starts[index + 1] ?? durationSeconds
    const end = Math.min(durationSeconds, Math.max(starts[index]! + 0.5, next - 0.05))
    return {
      startSeconds: Math.min(starts[index]!, durationSeconds - 0.2),
      endSeconds: Math.round(end * 1000) / 1000,
      text: text.length > CLIP_CUE_LIMITS.text ? `${text.slice(0, CLIP_CUE_LIMITS.text - 1)}…` : text,
    }
  })
}
