import { and, eq, inArray } from 'drizzle-orm'
import { z } from 'zod'
import { idParamsSchema } from '#shared/schemas/common'
import { mediaObjects } from '../../../../db/schema'

const playbackQuerySchema = z.object({ redirect: z.enum(['1', 'true', '0', 'false'], { error: 'redirect is 1 or 0' }).optional() })

/** A short-lived URL to play the clip straight from the store (range requests, so seeking works). */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const { id } = paramsWith(event, idParamsSchema)
  const { redirect } = queryWith(event, playbackQuerySchema)
  const db = await useDb()
  const { exercise } = await findTeamExercise(db, caller, id)
  if (!exercise.clipId) notFound('This exercise has no clip')

  const ids = [exercise.clipId, exercise.posterId].filter((value): value is number => value !== null)
  const media = await db.select().from(mediaObjects)
    .where(and(inArray(mediaObjects.id, ids), eq(mediaObjects.teamId, caller.teamId), eq(mediaObjects.status, 'ready')))
  const clip = media.find(object => object.id === exercise.clipId)
  if (!clip) notFound('This exercise has no clip')
  const poster = media.find(object => object.id === exercise.posterId)

  const playback = await presignPlayback(clip.key)
  setResponseHeader(event, 'cache-control', 'private, no-store')
  if (redirect === '1' || redirect === 'true') return sendRedirect(event, playback.url, 302)
  return {
    url: playback.url,
    expiresAt: playback.expiresAt,
    contentType: clip.contentType,
    size: clip.size,
    durationSeconds: clip.durationSeconds,
    width: clip.width,
    height: clip.height,
    captionsUrl: `/captions/${exercise.id}.vtt`,
    posterUrl: poster ? (await presignPlayback(poster.key)).url : null,
  }
})
