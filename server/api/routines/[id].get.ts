import { idParamsSchema } from '#shared/schemas/common'

/** One routine with the exercises it uses, for the builder and the print card. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const routine = await findTeamRoutine(db, caller.teamId, id)
  const exercises = await routineExerciseDetails(db, caller.teamId, routine.steps)
  return { ...publicRoutine(routine), exercises }
})
