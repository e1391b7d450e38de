import { idParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const { exercise, clip } = await findTeamExercise(db, caller, id)
  return exerciseView(exercise, clip)
})
