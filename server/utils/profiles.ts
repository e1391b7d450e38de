import { and, asc, desc, eq } from 'drizzle-orm'
import type { Database } from '../db/client'
import { athleteProfiles, injuryNotes } from '../db/schema'
import type { ProfilePatch } from '#shared/schemas/profile'
import { hrMaxTanaka } from '#shared/utils/heart'
import { trainingPaces, type TrainingPaces } from '#shared/utils/pace'

/** The profile page's data: stored values, injury notes, and what the app derives from them. */
export async function loadProfileView(db: Database, teamId: number, athlete: { id: number, name: string }) {
  const [[profile], notes] = await Promise.all([
    db.select().from(athleteProfiles).where(and(eq(athleteProfiles.userId, athlete.id), eq(athleteProfiles.teamId, teamId))).limit(1),
    db.select().from(injuryNotes).where(and(eq(injuryNotes.athleteId, athlete.id), eq(injuryNotes.teamId, teamId)))
      .orderBy(asc(injuryNotes.status), desc(injuryNotes.createdAt)),
  ])
  const age = profile?.birthYear ? new Date().getUTCFullYear() - profile.birthYear : null
  const hrMaxEstimate = age && age >= 8 && age <= 100 ? Math.round(hrMaxTanaka(age)) : null
  let paces: TrainingPaces | null = null
  if (profile?.benchmarkDistanceM && profile.benchmarkTimeS) {
    try {
      paces = trainingPaces({ distanceM: profile.benchmarkDistanceM, timeS: profile.benchmarkTimeS })
    }
    catch {
      // An implausible benchmark gives no paces rather than an error page.
      paces = null
    }
  }
  return {
    athlete,
    profile: {
      benchmarkDistanceM: profile?.benchmarkDistanceM ?? null,
      benchmarkTimeS: profile?.benchmarkTimeS ?? null,
      benchmarkDate: profile?.benchmarkDate ?? null,
      birthYear: profile?.birthYear ?? null,
      hrMax: profile?.hrMax ?? null,
      hrRest: profile?.hrRest ?? null,
      units: profile?.units ?? 'km',
      goal: profile?.goal ?? '',
    },
    derived: {
      age,
      /** Tanaka, Monahan & Seals (2001): 208 − 0.7 × age. */
      hrMaxEstimate,
      hrMax: profile?.hrMax ?? hrMaxEstimate,
      hrMaxSource: profile?.hrMax ? 'measured' as const : hrMaxEstimate ? 'estimate' as const : null,
      paces,
    },
    injuryNotes: notes.map(note => ({ id: note.id, bodyArea: note.bodyArea, status: note.status, note: note.note, since: note.since, createdAt: note.createdAt, updatedAt: note.updatedAt })),
  }
}

export async function saveProfile(db: Database, teamId: number, athleteId: number, patch: ProfilePatch) {
  await db.insert(athleteProfiles).values({ userId: athleteId, teamId, ...patch })
    .onConflictDoUpdate({ target: athleteProfiles.userId, set: { ...patch, updatedAt: new Date() }, setWhere: eq(athleteProfiles.teamId, teamId) })
}

export async function addInjuryNote(db: Database, teamId: number, athleteId: number, values: { bodyArea: string, note: string, since?: string | null, status: 'active' | 'resolved' }) {
  const [note] = await db.insert(injuryNotes).values({ teamId, athleteId, ...values }).returning()
  return note!
}
