import { and, eq, isNotNull } from 'drizzle-orm'
import type { Database } from '../db/client'
import { athleteProfiles, entryLogs, injuryNotes, users } from '../db/schema'
import { trainingPacesOrNull, type TrainingPaces } from '#shared/utils/pace'
import { e1rmEpley } from '#shared/utils/strength'

export interface AthleteContext {
  athlete: { id: number, name: string, timezone: string }
  profile: typeof athleteProfiles.$inferSelect | null
  paces: TrainingPaces | null
  injuryNotes: (typeof injuryNotes.$inferSelect)[]
  /** Best estimated 1RM per exercise from the athlete's logged sets (Epley 1985). */
  estimatedMaxKg: Record<number, number>
}

/** What paces, loads and cautions for one athlete are computed from. The athlete must be in `teamId`. */
export async function loadAthleteContext(db: Database, teamId: number, athleteId: number): Promise<AthleteContext | null> {
  const [row] = await db.select({ id: users.id, name: users.name, timezone: users.timezone, profile: athleteProfiles })
    .from(users)
    .leftJoin(athleteProfiles, eq(athleteProfiles.userId, users.id))
    .where(eq(users.id, athleteId)).limit(1)
  if (!row || (row.profile && row.profile.teamId !== teamId)) return null
  const [notes, sets] = await Promise.all([
    db.select().from(injuryNotes).where(and(eq(injuryNotes.athleteId, athleteId), eq(injuryNotes.teamId, teamId))),
    db.select({ exerciseId: entryLogs.exerciseId, kg: entryLogs.kg, reps: entryLogs.reps }).from(entryLogs)
      .where(and(eq(entryLogs.athleteId, athleteId), eq(entryLogs.teamId, teamId), isNotNull(entryLogs.exerciseId), isNotNull(entryLogs.kg), isNotNull(entryLogs.reps))),
  ])
  const estimatedMaxKg: Record<number, number> = {}
  for (const set of sets) {
    if (!set.exerciseId || !set.kg || !set.reps || set.reps > 12) continue
    const estimate = e1rmEpley(set.kg, set.reps)
    estimatedMaxKg[set.exerciseId] = Math.max(estimatedMaxKg[set.exerciseId] ?? 0, estimate)
  }
  const profile = row.profile
  const paces = profile?.benchmarkDistanceM && profile.benchmarkTimeS
    // An implausible benchmark saved before it was checked gives no paces rather than an error.
    ? trainingPacesOrNull({ distanceM: profile.benchmarkDistanceM, timeS: profile.benchmarkTimeS })
    : null
  return { athlete: { id: row.id, name: row.name, timezone: row.timezone }, profile, paces, injuryNotes: notes, estimatedMaxKg }
}
