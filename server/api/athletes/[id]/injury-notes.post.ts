import { idParamsSchema } from '#shared/schemas/common'
import { injuryNoteSchema } from '#shared/schemas/profile'

/** A coach records an injury note for one of the team's athletes. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const body = await readBodyWith(event, injuryNoteSchema)
  const db = await useDb()
  const athlete = await findTeamAthlete(db, caller.teamId, id)
  const note = await addInjuryNote(db, caller.teamId, athlete.id, body)
  setResponseStatus(event, 201)
  return note
})
