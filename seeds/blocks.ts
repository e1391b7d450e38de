import { and, eq, inArray } from 'drizzle-orm'
import { assignments, blocks, blockRoutines, blockTargets, routines, sessionLogs } from '../server/db/schema'
import { blockAthletes, computeBlockWeeks, loadBlock, overridesOf, slotRoutines, slotsOf, teamPlateKg, writeBlockPlan } from '../server/utils/block-plan'
import { addDays, startOfWeek, todayIn } from '../shared/utils/dates'
import { keyNumbers } from '../shared/utils/progression'
import type { SeedStep } from './context'

// One training block in progress for the trail squad: started two weeks before this week, so the demo
// opens on week 3 of 8 with two weeks logged. Saturdays' gym circuit gains a round every two weeks
// and its stations 5 s every week; week 4 is lighter and the last week tapers before the invented fell race.
const BLOCK_NAME = 'Fell race build'
const CIRCUIT = 'Template: Six-station gym circuit'

export const seedBlocks: SeedStep = async ({ db, teamId, users, squads, log }) => {
  const [existing] = await db.select({ id: blocks.id }).from(blocks).where(and(eq(blocks.teamId, teamId), eq(blocks.name, BLOCK_NAME))).limit(1)
  if (existing) return
  const [circuit] = await db.select({ id: routines.id }).from(routines).where(and(eq(routines.teamId, teamId), eq(routines.title, CIRCUIT))).limit(1)
  if (!circuit) {
    log(`no block: "${CIRCUIT}" is not seeded`)
    return
  }
  const startDate = addDays(startOfWeek(todayIn('Europe/London')), -14)
  const weeks = 8
  const blockId = await db.transaction(async (tx) => {
    const [row] = await tx.insert(blocks).values({
      teamId,
      name: BLOCK_NAME,
      startDate,
      weeks,
      goalRaceName: 'Larchford Quarry Fell Race',
      goalRaceDate: addDays(startDate, weeks * 7 - 2),
      goalRaceDistanceM: 14_000,
      lighter: { every: 4, factor: 0.7 },
      taper: { weeks: 1, factor: 0.6 },
      note: 'Strength for the descents; keep the gym easy the day before a long run.',
      createdById: users.headCoach,
    }).returning({ id: blocks.id })
    await tx.insert(blockTargets).values({ blockId: row!.id, squadId: squads.trail! })
    await tx.insert(blockRoutines).values({
      blockId: row!.id,
      routineId: circuit.id,
      weekday: 6,
      rules: [
        { stepId: 'rounds', field: 'rounds', by: 1, every: 2, cap: 5 },
        { stepId: 'squat', field: 'seconds', by: 5, cap: 60 },
      ],
      note: 'Club gym, 9 am.',
    })
    return row!.id
  })

  const loaded = await loadBlock(db, teamId, blockId)
  const athletes = (await blockAthletes(db, teamId, loaded.targets)).filter(athlete => users.athletes.includes(athlete.id))
  const routinesById = await slotRoutines(db, teamId, [circuit.id], () => 'routineId')
  const plan = computeBlockWeeks(loaded.block, slotsOf(loaded), routinesById, overridesOf(loaded), await teamPlateKg(db, teamId))
  await db.transaction(async (tx) => {
    const written = await writeBlockPlan(tx, { teamId, coachId: users.headCoach, loaded, athletes, weeks: plan, routinesById, fromWeek: 1 })
    await tx.update(blocks).set({ plannedAt: new Date(), plannedRevision: loaded.block.revision }).where(eq(blocks.id, blockId))
    log(`block: "${BLOCK_NAME}" for the trail squad from ${startDate}, ${written.created} sessions`)
  })

  // Weeks 1 and 2 done by everyone but the last athlete, who missed week 2.
  const past = await db.select({ id: assignments.id, athleteId: assignments.athleteId, date: assignments.date, week: assignments.blockWeek, snapshot: assignments.snapshot })
    .from(assignments).where(and(eq(assignments.blockId, blockId), inArray(assignments.blockWeek, [1, 2])))
  const skipper = athletes.at(-1)?.id
  for (const session of past) {
    if (session.athleteId === skipper && session.week === 2) continue
    const minutes = keyNumbers(session.snapshot.steps).durationS / 60
    const durationS = Math.round(minutes * 60 * 1.05)
    const startedAt = new Date(`${session.date}T09:00:00Z`)
    await db.insert(sessionLogs).values({
      teamId,
      assignmentId: session.id,
      athleteId: session.athleteId,
      clientId: `demo-block-${session.id}`,
      startedAt,
      finishedAt: new Date(startedAt.getTime() + durationS * 1000),
      day: session.date,
      durationS,
      sessionRpe: 6,
      load: Math.round(6 * durationS / 60),
    })
    await db.update(assignments).set({ status: 'done' }).where(eq(assignments.id, session.id))
  }
}
