import { injuryNoteSchema } from '#shared/schemas/profile'

export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const body = await readBodyWith(event, injuryNoteSchema)
  const db = await useDb()
  const note = await addInjuryNote(db, caller.teamId, caller.userId, body)
  setResponseStatus(event, 201)
  return note
})
