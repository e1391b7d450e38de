import { randomBytes } from 'node:crypto'
import { HeadBucketCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3'
import { and, eq, sql } from 'drizzle-orm'
import { exercises, mediaObjects } from '../server/db/schema'
import { starterExercises, starterSlug } from '../server/starter/exercises'
import { makeDemoClip } from './clip'
import type { SeedStep } from './context'

function seedStorage() {
  const endpoint = process.env.S3_ENDPOINT ?? 'http://127.0.0.1:4569'
  return {
    bucket: process.env.S3_BUCKET ?? 'switchback-media',
    client: new S3Client({
      endpoint,
      region: process.env.S3_REGION ?? 'us-east-1',
      credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID ?? 'S3RVER', secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? 'S3RVER' },
      forcePathStyle: true,
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      maxAttempts: 1,
      requestHandler: { connectionTimeout: 2000, requestTimeout: 10_000 },
    }),
  }
}

/** The starter library (idempotent by team and name) and a generated demo clip for a few exercises. */
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

  const withClips = starterExercises.filter(exercise => exercise.clip)
  const { client, bucket } = seedStorage()
  try {
    await client.send(new HeadBucketCommand({ Bucket: bucket }))
  }
  catch (error) {
    console.warn(`  warning: the object store (${process.env.S3_ENDPOINT ?? 'http://127.0.0.1:4569'}, bucket ${bucket}) cannot be reached, so demo clips were skipped: ${(error as Error).message || (error as Error).name}`)
    client.destroy()
    return
  }
  let uploaded = 0
  for (const exercise of withClips) {
    const id = ids.get(exercise.name)!
    const [current] = await db.select({ clipId: exercises.clipId }).from(exercises).where(eq(exercises.id, id)).limit(1)
    if (current?.clipId) continue
    const body = await makeDemoClip({ seconds: 3, ...exercise.clip })
    const key = `teams/${teamId}/exercises/${id}/${randomBytes(12).toString('hex')}.webm`
    await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: 'video/webm', ContentLength: body.byteLength }))
    await db.transaction(async (tx) => {
      const [media] = await tx.insert(mediaObjects).values({ teamId, exerciseId: id, key, purpose: 'clip', contentType: 'video/webm', size: body.byteLength, status: 'ready', createdById: users.headCoach }).returning({ id: mediaObjects.id })
      await tx.update(exercises).set({ clipId: media!.id }).where(eq(exercises.id, id))
    })
    uploaded += 1
  }
  client.destroy()
  log(`exercise clips: ${withClips.length} demo clips (${uploaded} new)`)
}
