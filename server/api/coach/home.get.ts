/** The coach's home page in one request. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  return keptAnswer(event, caller, async () => coachHome(await useDb(), caller.teamId))
})
