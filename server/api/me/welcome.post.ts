import { eq } from 'drizzle-orm'
import { welcomeSchema } from '#shared/schemas/team'
import { injuryNoteSchema } from '#shared/schemas/profile'
import { users } from '../../db/schema'

/** Saves what the athlete chose to answer on their first visit (or that they skipped), so the questions stop. */
export default defineEventHandler(async (event) => {
  const caller = await requireAthlete(event)
  const input = await readBodyWith(event, welcomeSchema)
  const db = await useDb()
  const injury = input.injury && !input.skip ? injuryNoteSchema.safeParse({ ...input.injury, status: 'active' }) : null
  if (injury && !injury.success) {
    refuseField('injury.bodyArea', 'Pick a body area from the list')
  }
  if (!input.skip) {
    const patch = {
      ...(input.benchmarkDistanceM !== undefined ? { benchmarkDistanceM: input.benchmarkDistanceM, benchmarkTimeS: input.benchmarkTimeS, benchmarkDate: input.benchmarkDate ?? null } : {}),
      ...(input.units ? { units: input.units } : {}),
    }
    if (Object.keys(patch).length) await saveProfile(db, caller.teamId, caller.userId, patch)
    if (injury?.success) await addInjuryNote(db, caller.teamId, caller.userId, injury.data)
  }
  await db.update(users).set({ welcomedAt: new Date(), ...(input.timezone && !input.skip ? { timezone: input.timezone } : {}) }).where(eq(users.id, caller.userId))
  forgetCallers({ userId: caller.userId })
  return { welcomed: true }
})
