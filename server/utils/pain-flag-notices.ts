import { and, eq, inArray } from 'drizzle-orm'
import type { Database } from '../db/client'
import type { painFlags } from '../db/schema'
import { memberships, users } from '../db/schema'
import type { Caller } from './auth'

type Transaction = Pick<Database, 'select' | 'insert'>

/** One e-mail per coach of the athlete's team for a new pain flag, except coaches who turned them off. */
export async function notifyCoachesOfPainFlag(tx: Transaction, athlete: Caller, flag: typeof painFlags.$inferSelect, routineTitle: string) {
  const coaches = await tx.select({ email: users.email, name: users.name })
    .from(memberships).innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.teamId, athlete.teamId), inArray(memberships.role, ['coach', 'head_coach']), eq(memberships.painFlagEmails, true)))
  const url = `${useServerConfig().appUrl}/insights/athletes/${athlete.userId}`
  for (const coach of coaches) {
    await enqueueEmail(tx, {
      to: coach.email,
      template: 'pain_flag_raised',
      teamId: athlete.teamId,
      payload: {
        coachName: coach.name,
        athleteName: athlete.name,
        teamName: athlete.teamName,
        routineTitle,
        pain: flag.pain,
        area: flag.area ?? '',
        reason: flag.reason,
        sudden: flag.sudden,
        url,
      },
    })
  }
  return coaches.length
}
