import { exerciseInputSchema } from '#shared/schemas/exercise'
import { exercises } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const input = await readBodyWith(event, exerciseInputSchema)
  const db = await useDb()
  await assertExerciseNameFree(db, caller.teamId, input.name)
  const [created] = await db.insert(exercises).values({ ...input, teamId: caller.teamId, createdById: caller.userId }).returning()
  setResponseStatus(event, 201)
  return exerciseView(created!)
})
