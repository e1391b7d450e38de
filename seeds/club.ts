import { and, eq } from 'drizzle-orm'
import type { Database } from '../server/db/client'
import { athleteProfiles, injuryNotes, memberships, squadMembers, squads, teams, users } from '../server/db/schema'
import { DEMO_PASSWORD, hashPassword, type SeedContext } from './context'

// An invented club in an invented town: Larchford, a small valley town with a long ridge road.
export const CLUB_NAME = 'Larchford Ridge Runners'

export const demoPeople = {
  headCoach: { name: 'Morwen Tay', email: 'morwen@larchford.example' },
  coach: { name: 'Idris Fenn', email: 'idris@larchford.example' },
}

interface DemoAthlete {
  name: string
  email: string
  squad: 'road' | 'trail'
  benchmark: { distanceM: number, timeS: number, date: string }
  birthYear: number
  hrRest: number
  units: 'km' | 'mi'
  goal: string
  injuries?: { bodyArea: string, note: string, status: 'active' | 'resolved', since: string }[]
}

export const demoAthletes: DemoAthlete[] = [
  { name: 'Tamsin Rook', email: 'tamsin@larchford.example', squad: 'road', benchmark: { distanceM: 10_000, timeS: 40 * 60, date: '2026-09-20' }, birthYear: 1994, hrRest: 48, units: 'km', goal: 'Larchford Ridge Half in under 1:30', injuries: [{ bodyArea: 'achilles', note: 'Stiff left Achilles in the mornings after hill sessions.', status: 'active', since: '2026-11-10' }] },
  { name: 'Cai Penhallow', email: 'cai@larchford.example', squad: 'road', benchmark: { distanceM: 5000, timeS: 19 * 60 + 30, date: '2026-10-04' }, birthYear: 2001, hrRest: 52, units: 'km', goal: 'Sub-19 at the Larchford club 5K' },
  { name: 'Ffion Aske', email: 'ffion@larchford.example', squad: 'trail', benchmark: { distanceM: 21_097.5, timeS: 1 * 3600 + 38 * 60, date: '2026-08-30' }, birthYear: 1987, hrRest: 50, units: 'mi', goal: 'Finish the Larchford Ridge Trail 30K feeling strong', injuries: [{ bodyArea: 'knee', note: 'Outside of right knee aches on long descents.', status: 'active', since: '2026-10-22' }] },
  { name: 'Oren Blythe', email: 'oren@larchford.example', squad: 'trail', benchmark: { distanceM: 10_000, timeS: 46 * 60 + 10, date: '2026-07-12' }, birthYear: 1979, hrRest: 55, units: 'km', goal: 'Back to racing after a calf strain', injuries: [{ bodyArea: 'calf', note: 'Right calf strain, cleared by the physio in October.', status: 'resolved', since: '2026-08-01' }] },
  { name: 'Juno Halloway', email: 'juno@larchford.example', squad: 'road', benchmark: { distanceM: 42_195, timeS: 3 * 3600 + 12 * 60, date: '2026-04-26' }, birthYear: 1990, hrRest: 47, units: 'km', goal: 'A spring marathon under 3:05' },
  { name: 'Wren Calder', email: 'wren@larchford.example', squad: 'trail', benchmark: { distanceM: 5000, timeS: 23 * 60 + 40, date: '2026-10-18' }, birthYear: 1998, hrRest: 58, units: 'km', goal: 'First trail half', injuries: [{ bodyArea: 'shin', note: 'Tender inner shin when mileage jumps.', status: 'active', since: '2026-11-20' }] },
]

async function upsertUser(db: Database, person: { name: string, email: string }, passwordHash: string) {
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, person.email)).limit(1)
  if (existing) return existing.id
  // Demo people have profiles seeded already, so they skip the first-visit questions.
  const [created] = await db.insert(users).values({ name: person.name, email: person.email, passwordHash, timezone: 'Europe/London', welcomedAt: new Date() }).returning({ id: users.id })
  return created!.id
}

async function ensureMembership(db: Database, teamId: number, userId: number, role: 'head_coach' | 'coach' | 'athlete') {
  await db.insert(memberships).values({ teamId, userId, role }).onConflictDoNothing()
}

async function ensureSquad(db: Database, teamId: number, name: string, description: string) {
  const [existing] = await db.select({ id: squads.id }).from(squads).where(and(eq(squads.teamId, teamId), eq(squads.name, name))).limit(1)
  if (existing) return existing.id
  const [created] = await db.insert(squads).values({ teamId, name, description }).returning({ id: squads.id })
  return created!.id
}

/** The club, its coaches, squads and athletes with benchmarks and injury notes. Safe to run again. */
export async function seedClub(db: Database, log: (line: string) => void): Promise<SeedContext> {
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  let [team] = await db.select({ id: teams.id }).from(teams).where(eq(teams.name, CLUB_NAME)).limit(1)
  team ??= (await db.insert(teams).values({ name: CLUB_NAME }).returning({ id: teams.id }))[0]!
  const teamId = team.id

  const headCoach = await upsertUser(db, demoPeople.headCoach, passwordHash)
  const coach = await upsertUser(db, demoPeople.coach, passwordHash)
  await ensureMembership(db, teamId, headCoach, 'head_coach')
  await ensureMembership(db, teamId, coach, 'coach')

  const squadIds = {
    road: await ensureSquad(db, teamId, 'Road squad', 'Road 5K to marathon; Tuesday track, Thursday hills.'),
    trail: await ensureSquad(db, teamId, 'Trail and ridge squad', 'Off-road and hilly races; more climbing and descending work.'),
  }

  const athletes: number[] = []
  for (const athlete of demoAthletes) {
    const userId = await upsertUser(db, athlete, passwordHash)
    athletes.push(userId)
    await ensureMembership(db, teamId, userId, 'athlete')
    await db.insert(squadMembers).values({ squadId: squadIds[athlete.squad], userId }).onConflictDoNothing()
    await db.insert(athleteProfiles).values({
      userId,
      teamId,
      benchmarkDistanceM: athlete.benchmark.distanceM,
      benchmarkTimeS: athlete.benchmark.timeS,
      benchmarkDate: athlete.benchmark.date,
      birthYear: athlete.birthYear,
      hrRest: athlete.hrRest,
      units: athlete.units,
      goal: athlete.goal,
    }).onConflictDoNothing()
    const [hasNotes] = await db.select({ id: injuryNotes.id }).from(injuryNotes).where(eq(injuryNotes.athleteId, userId)).limit(1)
    if (!hasNotes && athlete.injuries?.length) {
      await db.insert(injuryNotes).values(athlete.injuries.map(note => ({ teamId, athleteId: userId, ...note })))
    }
  }
  log(`club: ${CLUB_NAME} with 2 coaches, 2 squads and ${athletes.length} athletes`)
  return { db, teamId, users: { headCoach, coach, athletes }, squads: squadIds, log }
}
