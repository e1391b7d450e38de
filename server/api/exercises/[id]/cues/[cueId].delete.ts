import { and, eq } from 'drizzle-orm'
import { clipCues } from '../../../../db/schema'
import { clipCueParamsSchema } from '#shared/schemas/clip-cue'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id, cueId } = paramsWith(event, clipCueParamsSchema)
  const db = await useDb()
  await findTeamExercise(db, caller, id)
  const [removed] = await db.delete(clipCues)
    .where(and(eq(clipCues.id, cueId), eq(clipCues.exerciseId, id), eq(clipCues.teamId, caller.teamId)))
    .returning({ id: clipCues.id })
  if (!removed) notFound('No such cue')
  setResponseStatus(event, 204)
  return null
})
