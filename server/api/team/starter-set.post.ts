/** Adds the starter library (with demo clips) and starter routines to the caller's team; safe to repeat. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  return addStarterSet(db, caller.teamId, caller.userId)
})
