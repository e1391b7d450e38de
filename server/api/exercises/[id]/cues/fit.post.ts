import { and, eq } from 'drizzle-orm'
import { clipCues } from '../../../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { clipCueFitSchema } from '#shared/schemas/clip-cue'

/**
 * Fits the cues to a replaced, shorter clip: `scale` stretches every time by new length / old length;
 * `clamp` pulls only the cues past the end in to just before it. Cues are never deleted here.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const input = await readBodyWith(event, clipCueFitSchema)
  const db = await useDb()
  const { clip } = await findExerciseWithClip(db, caller, id)
  const duration = clip.durationSeconds
  if (duration === null) {
    const message = 'The clip\'s length is not known, so the cues cannot be fitted to it'
    refuseField('mode', message)
  }
  const rows = await listClipCues(db, caller.teamId, id)
  const round = (value: number) => Math.round(value * 1000) / 1000
  const last = Math.max(0, round(duration - 0.1))
  await db.transaction(async (tx) => {
    for (const row of rows) {
      let start = row.startSeconds
      let end = row.endSeconds
      if (input.mode === 'scale') {
        const factor = Math.min(1, duration / input.fromSeconds!)
        start = round(start * factor)
        end = end === null ? null : round(end * factor)
      }
      else {
        start = Math.min(start, last)
        end = end === null ? null : Math.min(end, duration)
      }
      if (end !== null && end <= start) end = null
      if (start !== row.startSeconds || end !== row.endSeconds) {
        await tx.update(clipCues).set({ startSeconds: start, endSeconds: end })
          .where(and(eq(clipCues.id, row.id), eq(clipCues.teamId, caller.teamId)))
      }
    }
  })
  return (await listClipCues(db, caller.teamId, id)).map(clipCueView)
})
