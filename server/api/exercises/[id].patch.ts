import { and, eq } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { exercisePatchSchema } from '#shared/schemas/exercise'
import { exercises } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const input = await readBodyWith(event, exercisePatchSchema)
  const db = await useDb()
  const { clip } = await findTeamExercise(db, caller, id)
  if (input.name !== undefined) await assertExerciseNameFree(db, caller.teamId, input.name, id)
  if (Object.keys(input).length === 0) {
    refuseField('_', 'Nothing to change')
  }
  const [updated] = await db.update(exercises).set(input).where(and(eq(exercises.id, id), eq(exercises.teamId, caller.teamId))).returning()
  if (!updated) notFound('No such exercise')
  return exerciseView(updated, clip)
})
