import { blockInputSchema } from '#shared/schemas/block'

/** Weeks × routines for a block as drafted, before it is saved: the same numbers planning would write. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const input = await readBodyWith(event, blockInputSchema)
  const db = await useDb()
  const routinesById = await checkBlockInput(db, caller.teamId, input)
  const plateKg = await teamPlateKg(db, caller.teamId)
  const draft = { ...blockValues(input) }
  const weeks = computeBlockWeeks(draft, inputSlots(input), routinesById, [], plateKg)
  const athletes = await blockAthletes(db, caller.teamId, { athleteIds: input.athleteIds, squadIds: input.squadIds })
  return { weeks, plateKg, athletes: athletes.map(athlete => ({ id: athlete.id, name: athlete.name })) }
})
