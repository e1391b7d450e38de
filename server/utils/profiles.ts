import { and, asc, desc, eq } from 'drizzle-orm'
import type { Database } from '../db/client'
import { athleteProfiles, injuryNotes } from '../db/schema'
import type { ProfilePatch } from '#shared/schemas/profile'
import { isUnder18 } from '#shared/utils/age'
import { hrMaxTanaka } from '#shared/utils/heart'
import { benchmarkProblem, trainingPaces, type TrainingPaces } from '#shared/utils/pace'

/** The profile page's data: stored values, injury notes, and what the app derives from them. */
export async function loadProfileView(db: Database, teamId: number, athlete: { id: number, name: string }) {
  const [[profile], notes] = await Promise.all([
    // The profile is the person's own (one per athlete, whichever teams they are in); callers check membership.
    db.select().from(athleteProfiles).where(eq(athleteProfiles.userId, athlete.id)).limit(1),
    db.select().from(injuryNotes).where(and(eq(injuryNotes.athleteId, athlete.id), eq(injuryNotes.teamId, teamId)))
      .orderBy(asc(injuryNotes.status), desc(injuryNotes.createdAt)),
  ])
  const age = profile?.birthYear ? new Date().getUTCFullYear() - profile.birthYear : null
  const under18 = isUnder18(profile?.birthYear)
  // Published age formulas were fitted on adults: no age-based estimate for athletes under 18.
  const hrMaxEstimate = age && !under18 && age <= 100 ? Math.round(hrMaxTanaka(age)) : null
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
      guardianContact: profile?.guardianContact ?? '',
    },
    derived: {
      age,
      under18,
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
  // The benchmark as it will be after this change must be one the pace equations can use.
  if (patch.benchmarkDistanceM !== undefined || patch.benchmarkTimeS !== undefined) {
    const [stored] = await db.select({ distanceM: athleteProfiles.benchmarkDistanceM, timeS: athleteProfiles.benchmarkTimeS })
      .from(athleteProfiles).where(and(eq(athleteProfiles.userId, athleteId), eq(athleteProfiles.teamId, teamId))).limit(1)
    const distanceM = patch.benchmarkDistanceM !== undefined ? patch.benchmarkDistanceM : stored?.distanceM ?? null
    const timeS = patch.benchmarkTimeS !== undefined ? patch.benchmarkTimeS : stored?.timeS ?? null
    const problem = distanceM && timeS ? benchmarkProblem({ distanceM, timeS }) : null
    if (problem) {
      refuseFields({ benchmarkTimeS: problem, _: problem })
    }
  }
  await db.insert(athleteProfiles).values({ userId: athleteId, teamId, ...patch })
    .onConflictDoUpdate({ target: athleteProfiles.userId, set: { ...patch, updatedAt: new Date() } })
}

export async function addInjuryNote(db: Database, teamId: number, athleteId: number, values: { bodyArea: string, note: string, since?: string | null, status: 'active' | 'resolved' }) {
  const [note] = await db.insert(injuryNotes).values({ teamId, athleteId, ...values }).returning()
  return note!
}
