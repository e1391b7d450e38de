import { eq } from 'drizzle-orm'
import { teams } from '../../db/schema'
import { plateSettingSchema } from '#shared/schemas/block'

/** The smallest total load step the team's plates allow; block loads round to it. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const input = await readBodyWith(event, plateSettingSchema)
  const db = await useDb()
  await db.update(teams).set({ plateIncrementKg: input.plateIncrementKg }).where(eq(teams.id, caller.teamId))
  return { plateIncrementKg: input.plateIncrementKg }
})
