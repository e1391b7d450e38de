import { and, desc, eq, inArray, ne, or } from 'drizzle-orm'
import type { Database } from '../db/client'
import { formReviews, injuryNotes, mediaObjects, memberships, painFlags, sessionLogs, squadMembers, squads, teams } from '../db/schema'
import { labelFormerAthlete } from './former-athletes'
import { deleteObject } from './storage'

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
 * (the team's history); `anonymise` clears the free text they or their coaches wrote about them and,
 * for an athlete, shows them as "Former athlete N" wherever the team sees that history. Their form-review
 * clips show the person, so anonymising deletes them: the objects leave the store first (with the store
 * down this answers 503 and nothing changes), then the records.
 */
export async function endMembership(db: Database, teamId: number, userId: number, options: { anonymise: boolean }) {
  const [member] = await db.select({ role: memberships.role }).from(memberships)
    .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId))).limit(1)
  const anonymiseAthlete = options.anonymise && member?.role === 'athlete'
  const clips = anonymiseAthlete
    ? await db.select({ id: mediaObjects.id, key: mediaObjects.key }).from(formReviews)
        .innerJoin(mediaObjects, or(eq(mediaObjects.id, formReviews.clipId), eq(mediaObjects.id, formReviews.replyClipId)))
        .where(and(eq(formReviews.teamId, teamId), eq(formReviews.athleteId, userId)))
    : []
  for (const clip of clips) await deleteObject(clip.key)
  await db.transaction(async (tx) => {
    const teamSquads = tx.select({ id: squads.id }).from(squads).where(eq(squads.teamId, teamId))
    await tx.delete(squadMembers).where(and(eq(squadMembers.userId, userId), inArray(squadMembers.squadId, teamSquads)))
    await tx.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)))
    if (options.anonymise) {
      await tx.delete(injuryNotes).where(and(eq(injuryNotes.teamId, teamId), eq(injuryNotes.athleteId, userId)))
      await tx.update(sessionLogs).set({ note: '' }).where(and(eq(sessionLogs.teamId, teamId), eq(sessionLogs.athleteId, userId)))
      await tx.update(painFlags).set({ reply: null }).where(and(eq(painFlags.teamId, teamId), eq(painFlags.athleteId, userId)))
    }
    if (anonymiseAthlete) {
      await labelFormerAthlete(tx, teamId, userId)
      if (clips.length) await tx.update(mediaObjects).set({ status: 'deleted' }).where(inArray(mediaObjects.id, clips.map(clip => clip.id)))
      await tx.delete(formReviews).where(and(eq(formReviews.teamId, teamId), eq(formReviews.athleteId, userId)))
    }
  })
  forgetCallers({ userId, teamId })
}
