import { and, desc, eq, inArray, ne } from 'drizzle-orm'
import type { Database } from '../db/client'
import { injuryNotes, memberships, painFlags, sessionLogs, squadMembers, squads, teams } from '../db/schema'

/** Every team the person belongs to, newest membership first. */
export async function teamsOf(db: Pick<Database, 'select'>, userId: number) {
  return db.select({ id: teams.id, name: teams.name, role: memberships.role })
    .from(memberships).innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, userId)).orderBy(desc(memberships.createdAt), desc(memberships.id))
}

export async function headCoachCount(db: Pick<Database, 'select'>, teamId: number, exceptUserId?: number) {
  const rows = await db.select({ id: memberships.userId }).from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'head_coach'), exceptUserId ? ne(memberships.userId, exceptUserId) : undefined))
  return rows.length
}

/**
 * Ends a person's membership of one team. Their sessions, logs and pain flags stay with the team
 * (the team's history); `anonymise` clears the free text they or their coaches wrote about them.
 */
export async function endMembership(db: Database, teamId: number, userId: number, options: { anonymise: boolean }) {
  await db.transaction(async (tx) => {
    const teamSquads = tx.select({ id: squads.id }).from(squads).where(eq(squads.teamId, teamId))
    await tx.delete(squadMembers).where(and(eq(squadMembers.userId, userId), inArray(squadMembers.squadId, teamSquads)))
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    if (options.anonymise) {
      await tx.delete(injuryNotes).where(and(eq(injuryNotes.teamId, teamId), eq(injuryNotes.athleteId, userId)))
      await tx.update(sessionLogs).set({ note: '' }).where(and(eq(sessionLogs.teamId, teamId), eq(sessionLogs.athleteId, userId)))
      await tx.update(painFlags).set({ reply: null }).where(and(eq(painFlags.teamId, teamId), eq(painFlags.athleteId, userId)))
    }
  })
  forgetCallers({ userId, teamId })
}
