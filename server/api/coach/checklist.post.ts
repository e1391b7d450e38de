import { eq } from 'drizzle-orm'
import { checklistSchema } from '#shared/schemas/team'
import { teams } from '../../db/schema'

/** Hides (or brings back) the first-run checklist on the coach's home, for the whole team. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { dismissed } = await readBodyWith(event, checklistSchema)
  const db = await useDb()
  await db.update(teams).set({ checklistDismissedAt: dismissed ? new Date() : null }).where(eq(teams.id, caller.teamId))
  return { dismissed }
})
