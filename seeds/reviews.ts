import { randomBytes } from 'node:crypto'
import { HeadBucketCommand, PutObjectCommand } from '@aws-sdk/client-s3'
import { eq } from 'drizzle-orm'
import { formReviewComments, formReviews, mediaObjects } from '../server/db/schema'
import type { SeedStep } from './context'
import { seedStorage } from './exercises'
import { figureStyles } from './figure'
import { renderFigureClip } from './figure-clip'
import { exerciseMovements } from './movements'

/** One answered form review: an athlete's A-skips clip with two comments from the coach at their moments. */
export const seedReviews: SeedStep = async ({ db, teamId, users, log }) => {
  const athleteId = users.athletes[0]
  if (!athleteId) return
  const [existing] = await db.select({ id: formReviews.id }).from(formReviews).where(eq(formReviews.teamId, teamId)).limit(1)
  if (existing) return
  const { client, bucket } = seedStorage()
  try {
    await client.send(new HeadBucketCommand({ Bucket: bucket }))
    // The athlete's clip is drawn like the library's, in the stride colours, from the A-skip keyframes.
    const clip = await renderFigureClip(exerciseMovements['A-skips']!.movement, figureStyles.stride!)
    const key = `teams/${teamId}/reviews/${athleteId}/${randomBytes(12).toString('hex')}.webm`
    await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: clip.webm, ContentType: 'video/webm', ContentLength: clip.webm.byteLength }))
    await db.transaction(async (tx) => {
      const [media] = await tx.insert(mediaObjects).values({ teamId, exerciseId: null, key, purpose: 'clip', contentType: 'video/webm', size: clip.webm.byteLength, durationSeconds: clip.durationSeconds, width: clip.width, height: clip.height, status: 'ready', createdById: athleteId }).returning({ id: mediaObjects.id })
      const [review] = await tx.insert(formReviews).values({
        teamId,
        athleteId,
        clipId: media!.id,
        question: 'Are my A-skips getting the knee high enough?',
        status: 'answered',
        answeredAt: new Date(),
        answeredById: users.coach,
      }).returning({ id: formReviews.id })
      await tx.insert(formReviewComments).values([
        { teamId, reviewId: review!.id, authorId: users.coach, atSeconds: 0.5, text: 'Good tall posture through the hop.' },
        { teamId, reviewId: review!.id, authorId: users.coach, atSeconds: 2, text: 'Here: drive the knee to hip height and pull the toes up before the foot comes down.' },
      ])
    })
    log('form reviews: one answered review with two comments')
  }
  catch (error) {
    console.warn(`  warning: the demo form review was skipped: ${(error as Error).message || (error as Error).name}`)
  }
  finally {
    client.destroy()
  }
}
