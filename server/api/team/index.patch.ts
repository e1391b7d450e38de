import { eq } from 'drizzle-orm'
import { teamSettingsSchema } from '#shared/schemas/team'
import { teams } from '../../db/schema'

/** Renames the team, sets its emergency number, time zone or how long review clips are kept: the head coach only. */
export default defineEventHandler(async (event) => {
  const caller = await requireHeadCoach(event)
  const input = await readBodyWith(event, teamSettingsSchema)
  const db = await useDb()
  const [team] = await db.update(teams).set({
    ...(input.name !== undefined ? { name: input.name } : {}),
    ...(input.emergencyNumber !== undefined ? { emergencyNumber: input.emergencyNumber } : {}),
    ...(input.timezone !== undefined ? { timezone: input.timezone } : {}),
    ...(input.reviewRetentionDays !== undefined ? { reviewRetentionDays: input.reviewRetentionDays } : {}),
  }).where(eq(teams.id, caller.teamId)).returning({ id: teams.id, name: teams.name, emergencyNumber: teams.emergencyNumber, timezone: teams.timezone, reviewRetentionDays: teams.reviewRetentionDays })
  forgetCallers({ teamId: caller.teamId })
  return team
})
