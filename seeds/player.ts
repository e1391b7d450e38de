import { and, eq, inArray, lt } from 'drizzle-orm'
import { assignments, entryLogs, painFlags, sessionLogs } from '../server/db/schema'
import { loadAthleteContext } from '../server/utils/athlete-context'
import { sessionLoad } from '../shared/utils/load'
import { planSession } from '../shared/utils/session-plan'
import type { SeedStep } from './context'

/**
 * Logged sessions for the demo club's past assignments (those the planner's seed created): about two
 * in three done, with the prescribed sets, a spread of effort, and one high pain report for the coach.
 * Runs after the planner's seed; does nothing when there are no past assignments. Safe to run again.
 */
export const seedPlayer: SeedStep = async ({ db, teamId, log }) => {
  const today = new Date().toISOString().slice(0, 10)
  const past = await db.select().from(assignments)
    .where(and(eq(assignments.teamId, teamId), lt(assignments.date, today), eq(assignments.status, 'planned')))
  if (!past.length) return
  const logged = await db.select({ assignmentId: sessionLogs.assignmentId }).from(sessionLogs)
    .where(and(eq(sessionLogs.teamId, teamId), inArray(sessionLogs.assignmentId, past.map(item => item.id))))
  const done = new Set(logged.map(row => row.assignmentId))
  let sessions = 0
  let flagged = false
  for (const assignment of past) {
    if (done.has(assignment.id) || assignment.id % 3 === 0) continue
    const context = await loadAthleteContext(db, teamId, assignment.athleteId)
    if (!context) continue
    const plan = planSession(assignment.snapshot, { paces: context.paces, estimatedMaxKg: context.estimatedMaxKg, injuryNotes: context.injuryNotes })
    const rpe = 4 + (assignment.id % 5)
    const durationS = Math.round(plan.totals.durationS)
    const startedAt = new Date(`${assignment.date}T17:30:00Z`)
    const activeArea = context.injuryNotes.find(note => note.status === 'active')?.bodyArea ?? null
    const pain = activeArea ? (flagged ? 2 : 4) : 0
    const [session] = await db.insert(sessionLogs).values({
      teamId,
      assignmentId: assignment.id,
      athleteId: assignment.athleteId,
      clientId: `seed-${assignment.id}`,
      startedAt,
      finishedAt: new Date(startedAt.getTime() + durationS * 1000),
      day: assignment.date,
      durationS,
      sessionRpe: rpe,
      load: sessionLoad(rpe, durationS / 60),
      pain,
      painArea: pain ? activeArea : null,
      note: pain >= 4 ? 'Sore towards the end; eased off on the last round.' : '',
    }).onConflictDoNothing().returning()
    if (!session) continue
    const entries = plan.segments.filter(segment => segment.loggable).map(segment => ({
      teamId,
      sessionId: session.id,
      athleteId: assignment.athleteId,
      idempotencyKey: `seed-${assignment.id}:${segment.key}`,
      stepId: segment.stepId,
      exerciseId: segment.exerciseId,
      set: segment.set,
      round: segment.round,
      reps: segment.measure === 'reps' ? segment.reps : null,
      kg: segment.targetKg,
      seconds: segment.measure === 'reps' ? null : Math.round(segment.durationS),
      meters: segment.meters,
    }))
    if (entries.length) await db.insert(entryLogs).values(entries).onConflictDoNothing()
    if (pain >= 4) {
      await db.insert(painFlags).values({ teamId, athleteId: assignment.athleteId, sessionId: session.id, pain, area: activeArea, reason: 'high_pain' })
      flagged = true
    }
    await db.update(assignments).set({ status: 'done' }).where(eq(assignments.id, assignment.id))
    sessions += 1
  }
  log(`${sessions} logged sessions`)
}
