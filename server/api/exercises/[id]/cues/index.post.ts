import { clipCues } from '../../../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { CLIP_CUE_LIMITS, clipCueInputSchema } from '#shared/schemas/clip-cue'

/** Pins a cue to a moment of the clip (and optionally until an end). */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const input = await readBodyWith(event, clipCueInputSchema)
  const db = await useDb()
  const { clip } = await findExerciseWithClip(db, caller, id)
  assertCueFits(input, clip.durationSeconds)

  const created = await db.transaction(async (tx) => {
    if (await countClipCues(tx, caller.teamId, id) >= CLIP_CUE_LIMITS.perClip) {
      const message = `A clip has at most ${CLIP_CUE_LIMITS.perClip} cues; remove one first`
      refuseField('cues', message)
    }
    const [row] = await tx.insert(clipCues).values({ teamId: caller.teamId, exerciseId: id, ...input, createdById: caller.userId }).returning()
    return row!
  })
  setResponseStatus(event, 201)
  return clipCueView(created)
})
