import { and, eq, inArray, isNull } from 'drizzle-orm'
import { assignments, assignmentSeries, routines, squadMembers } from '../server/db/schema'
import { snapshotRoutine } from '../server/utils/snapshot'
import { addDays, seriesDates, startOfWeek, todayIn } from '../shared/utils/dates'
import type { SeedStep } from './context'

// A six-week winter block for the demo club, starting this week. Routines come from the builder's
// seeds, found by title; any that are missing are skipped, so this step never fails on its own.
const BLOCK_WEEKS = 6
const BLOCK_NOTE = 'Winter block: keep the easy days easy around these.'

const plans: { squad: 'road' | 'trail', titles: string[], weekdays: number[], note: string }[] = [
  { squad: 'road', titles: ['Template: Short hills, 8 × 60 s', 'Ridge road hill reps'], weekdays: [2], note: 'Ridge road lay-by, 6:30 pm. Jog down gently.' },
  { squad: 'road', titles: ['Template: Six-station gym circuit'], weekdays: [5], note: 'Club gym; bring a towel.' },
  { squad: 'trail', titles: ['Template: Short hills, 8 × 60 s', 'Ridge road hill reps'], weekdays: [4], note: 'Quarry track; walk the steepest descents.' },
  { squad: 'trail', titles: ['Template: Drills warm-up', 'Template: Strides after an easy run'], weekdays: [1], note: BLOCK_NOTE },
]

export const seedPlan: SeedStep = async ({ db, teamId, users, squads, log }) => {
  const blockStart = startOfWeek(todayIn('Europe/London'))
  for (const plan of plans) {
    const [routine] = await db.select({ id: routines.id, title: routines.title }).from(routines)
      .where(and(eq(routines.teamId, teamId), inArray(routines.title, plan.titles), isNull(routines.archivedAt))).limit(1)
    if (!routine) {
      log(`no plan for the ${plan.squad} squad's ${plan.titles[0]}: that routine is not seeded`)
      continue
    }
    const squadId = squads[plan.squad]!
    // One seeded series per squad and routine, whatever day the seed runs again.
    const [existing] = await db.select({ id: assignmentSeries.id }).from(assignmentSeries)
      .where(and(eq(assignmentSeries.teamId, teamId), eq(assignmentSeries.squadId, squadId), eq(assignmentSeries.routineId, routine.id), eq(assignmentSeries.note, plan.note))).limit(1)
    if (existing) continue

    const { routine: current, snapshot } = await snapshotRoutine(db, teamId, routine.id)
    const members = await db.select({ userId: squadMembers.userId }).from(squadMembers).where(eq(squadMembers.squadId, squadId))
    const athleteIds = members.map(member => member.userId).filter(id => users.athletes.includes(id))
    const pattern = { startDate: blockStart, weeks: BLOCK_WEEKS, weekdays: plan.weekdays }
    const dates = seriesDates(pattern)
    await db.transaction(async (tx) => {
      const [series] = await tx.insert(assignmentSeries).values({ teamId, routineId: routine.id, squadId, ...pattern, note: plan.note, createdById: users.headCoach }).returning({ id: assignmentSeries.id })
      await tx.insert(assignments).values(athleteIds.flatMap(athleteId => dates.map(date => ({
        teamId,
        athleteId,
        routineId: routine.id,
        routineVersion: current.version,
        snapshot,
        date,
        seriesId: series!.id,
        note: plan.note,
        assignedById: users.headCoach,
      }))))
    })
    log(`plan: ${routine.title} for the ${plan.squad} squad, ${dates.length} sessions each from ${blockStart} to ${addDays(blockStart, BLOCK_WEEKS * 7 - 1)}`)
  }
}
