import { and, eq, sql } from 'drizzle-orm'
import { assignments, entryLogs, exercises, painFlags, routines, sessionLogs } from '../server/db/schema'
import type { AssignmentSnapshot } from '../shared/types/domain'
import type { RoutineStep } from '../shared/schemas/routine-steps'
import { addDays, todayIn } from '../shared/utils/dates'
import type { SeedStep } from './context'

// Six weeks of past training for the demo athletes, so the insights pages have something to show.
// Skipped when the team already has session logs (from the session player's own demo data, or an earlier run).
const TITLE = 'Ridge strength circuit'

function squatSets(exerciseId: number): RoutineStep[] {
  return [{ id: 'goblet-squat', type: 'sets', exerciseId, sets: 3, perSet: { by: 'reps', reps: 8 }, restSeconds: 90 }]
}

export const seedInsights: SeedStep = async ({ db, teamId, users, log }) => {
  const [existing] = await db.select({ count: sql<number>`count(*)` }).from(sessionLogs).where(eq(sessionLogs.teamId, teamId))
  if (Number(existing?.count ?? 0) > 0) {
    log('insights: the team already has session logs, no extra history added')
    return
  }
  let [squat] = await db.select().from(exercises).where(and(eq(exercises.teamId, teamId), eq(exercises.name, 'Goblet squat'))).limit(1)
  squat ??= (await db.insert(exercises).values({ teamId, name: 'Goblet squat', category: 'strength', summary: 'Squat holding one weight at the chest.', cues: ['Chest tall', 'Knees track over toes'] }).returning())[0]!
  let [routine] = await db.select().from(routines).where(and(eq(routines.teamId, teamId), eq(routines.title, TITLE))).limit(1)
  routine ??= (await db.insert(routines).values({ teamId, title: TITLE, category: 'strength', description: 'Goblet squats for climbing strength.', steps: squatSets(squat.id), createdById: users.coach }).returning())[0]!
  const snapshot: AssignmentSnapshot = {
    title: TITLE,
    category: 'strength',
    description: routine.description,
    steps: routine.steps,
    exercises: [{ id: squat.id, name: squat.name, category: squat.category, summary: squat.summary, cues: squat.cues, equipment: squat.equipment, cautions: squat.cautions }],
  }
  const today = todayIn('Europe/London')

  await db.transaction(async (tx) => {
    for (const [index, athleteId] of users.athletes.entries()) {
      // Three sessions a week for six weeks; each athlete misses a different share and trains at a different effort.
      for (let daysAgo = 41; daysAgo >= 0; daysAgo--) {
        const day = addDays(today, -daysAgo)
        const weekday = new Date(`${day}T00:00:00Z`).getUTCDay()
        if (![1, 3, 5].includes(weekday)) continue
        const done = (daysAgo + index) % (index + 4) !== 0
        const [assignment] = await tx.insert(assignments).values({ teamId, athleteId, routineId: routine.id, routineVersion: routine.version, snapshot, date: day, status: done ? 'done' : 'skipped', assignedById: users.coach }).returning()
        if (!done) continue
        // The last fortnight is harder for some, so their ratios rise above the guide band.
        const rpe = Math.min(9, 4 + (index % 3) + (daysAgo < 10 && index % 2 === 0 ? 3 : 0))
        const minutes = 40 + (index % 3) * 5
        const painful = index === 2 && daysAgo < 5
        const startedAt = new Date(`${day}T17:30:00Z`)
        const [session] = await tx.insert(sessionLogs).values({
          teamId, assignmentId: assignment!.id, athleteId, clientId: `demo-insights-${assignment!.id}`,
          startedAt, finishedAt: new Date(startedAt.getTime() + minutes * 60_000), day,
          durationS: minutes * 60, sessionRpe: rpe, load: rpe * minutes,
          pain: painful ? 6 : null, painArea: painful ? 'knee' : null,
          note: painful ? (daysAgo === 0 ? 'Outside of the right knee ached on the step-downs.' : 'Right knee niggled on the step-downs; fine on the flat.') : daysAgo % 9 === 0 ? 'Felt springy on the calf raises.' : '',
        }).returning()
        const kg = 16 + index * 2 + Math.floor((41 - daysAgo) / 7) * 2
        await tx.insert(entryLogs).values([1, 2, 3].map(set => ({ teamId, sessionId: session!.id, athleteId, idempotencyKey: `demo-${set}`, stepId: 'goblet-squat', exerciseId: squat.id, set, reps: 8, kg })))
        if (painful && daysAgo < 3) {
          await tx.insert(painFlags).values({ teamId, athleteId, sessionId: session!.id, pain: 6, area: 'knee', reason: 'high_pain' })
        }
      }
    }
  })
  log(`insights: six weeks of sessions for ${users.athletes.length} athletes`)
}
