import { eq } from 'drizzle-orm'
import { athleteProfiles } from '../../db/schema'
import { racePaceTable } from '#shared/utils/race-paces'

/** Race equivalents and training paces from the signed-in athlete's benchmark race, in km and mile units. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const db = await useDb()
  const [profile] = await db.select().from(athleteProfiles)
    .where(eq(athleteProfiles.userId, caller.userId)).limit(1)
  const units = profile?.units ?? 'km'
  if (!profile || profile.teamId !== caller.teamId || !profile.benchmarkDistanceM || !profile.benchmarkTimeS) {
    return { benchmark: null, units, table: null, error: null }
  }
  const benchmark = { distanceM: profile.benchmarkDistanceM, timeS: profile.benchmarkTimeS, date: profile.benchmarkDate }
  try {
    return { benchmark, units, table: racePaceTable(benchmark), error: null }
  }
  catch (error) {
    // The pace math refuses results outside the range its equations cover; say why instead of failing.
    return { benchmark, units, table: null, error: error instanceof RangeError ? error.message : 'These paces could not be worked out' }
  }
})
