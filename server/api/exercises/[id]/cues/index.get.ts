import { idParamsSchema } from '#shared/schemas/common'

/** The cues pinned to moments of the exercise's clip, in time order. */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  await findTeamExercise(db, caller, id)
  const rows = await listClipCues(db, caller.teamId, id)
  return rows.map(clipCueView)
})
