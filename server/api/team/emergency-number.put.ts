import { eq } from 'drizzle-orm'
import { emergencyNumberSchema } from '#shared/schemas/safety'
import { teams } from '../../db/schema'

/** The emergency number the urgent-help guidance names; a team setting, so only the head coach sets it. */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'head_coach')
  const { emergencyNumber } = await readBodyWith(event, emergencyNumberSchema)
  const db = await useDb()
  await db.update(teams).set({ emergencyNumber }).where(eq(teams.id, caller.teamId))
  return { emergencyNumber }
})
