import { and, eq } from 'drizzle-orm'
import { memberships, teams } from '../../db/schema'

/** The team's safety settings and the caller's own pain-report e-mail switch. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  const [row] = await db.select({ emergencyNumber: teams.emergencyNumber, painFlagEmails: memberships.painFlagEmails })
    .from(memberships).innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(and(eq(memberships.teamId, caller.teamId), eq(memberships.userId, caller.userId))).limit(1)
  return {
    emergencyNumber: row?.emergencyNumber ?? null,
    painFlagEmails: row?.painFlagEmails ?? true,
    canEditTeam: caller.role === 'head_coach',
  }
})
