import { and, eq } from 'drizzle-orm'
import { clipCues } from '../../../../db/schema'
import { clipCueParamsSchema, clipCuePatchSchema } from '#shared/schemas/clip-cue'

/** Moves a cue (start and end) or rewrites its text; fields not sent stay as they are. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id, cueId } = paramsWith(event, clipCueParamsSchema)
  const input = await readBodyWith(event, clipCuePatchSchema)
  const db = await useDb()
  const { clip } = await findExerciseWithClip(db, caller, id)
  const where = and(eq(clipCues.id, cueId), eq(clipCues.exerciseId, id), eq(clipCues.teamId, caller.teamId))
  const [current] = await db.select().from(clipCues).where(where).limit(1)
  if (!current) notFound('No such cue')

  const next = {
    startSeconds: input.startSeconds ?? current.startSeconds,
    endSeconds: input.endSeconds === undefined ? current.endSeconds : input.endSeconds,
    text: input.text ?? current.text,
  }
  assertCueFits(next, clip.durationSeconds)
  const [updated] = await db.update(clipCues).set(next).where(where).returning()
  return clipCueView(updated!)
})
