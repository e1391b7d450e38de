/** The team's smallest load step, for the blocks page. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  return { plateIncrementKg: await teamPlateKg(db, caller.teamId) }
})
