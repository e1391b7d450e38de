import { routineInputSchema } from '#shared/schemas/routine'
import { routines } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const input = await readBodyWith(event, routineInputSchema)
  const db = await useDb()
  await assertRoutineExercises(db, caller.teamId, input.steps)
  const routine = await db.transaction(async (tx) => {
    const [created] = await tx.insert(routines).values({ ...input, teamId: caller.teamId, createdById: caller.userId }).returning()
    await writeRoutineExercises(tx, created!.id, input.steps)
    return created!
  })
  setResponseStatus(event, 201)
  return { id: routine.id, version: routine.version }
})
