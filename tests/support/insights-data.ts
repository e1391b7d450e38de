import { openDatabase, type Database } from '../../server/db/client'
import { assignments, entryLogs, exercises, painFlags, routines, sessionLogs } from '../../server/db/schema'
import type { AssignmentSnapshot } from '../../shared/types/domain'
import { addDays } from '../../shared/utils/dates'

// Inserts training history straight into the test database, the way the planner and the player would leave it.

export async function openTestDatabase(url: string) {
  return openDatabase(url)
}

export async function createRoutine(db: Database, teamId: number, title = 'Hill strength circuit') {
  const [exercise] = await db.insert(exercises).values({ teamId, name: 'Back squat', category: 'strength' }).returning()
  const [routine] = await db.insert(routines).values({ teamId, title, category: 'strength', steps: [] }).returning()
  const snapshot: AssignmentSnapshot = { title, category: 'strength', description: '', steps: [], exercises: [] }
  return { routineId: routine!.id, exerciseId: exercise!.id, snapshot }
}

export interface HistoryDay {
  /** Days before today (0 = today, negative = in the future). */
  daysAgo: number
  done: boolean
  load?: number
  durationS?: number
  sessionRpe?: number
  pain?: number
  painArea?: string
  note?: string
  sets?: { kg: number, reps: number }[]
}

/** One assignment per listed day; a finished session log (and its sets) on the days marked done. */
export async function insertHistory(db: Database, options: { teamId: number, athleteId: number, today: string, routine: Awaited<ReturnType<typeof createRoutine>>, days: HistoryDay[] }) {
  const sessions: { id: number, day: string, assignmentId: number }[] = []
  for (const entry of options.days) {
    const day = addDays(options.today, -entry.daysAgo)
    const [assignment] = await db.insert(assignments).values({
      teamId: options.teamId,
      athleteId: options.athleteId,
      routineId: options.routine.routineId,
      routineVersion: 1,
      snapshot: options.routine.snapshot,
      date: day,
      status: entry.done ? 'done' : 'planned',
    }).returning()
    if (!entry.done) continue
    const startedAt = new Date(`${day}T07:00:00Z`)
    const [session] = await db.insert(sessionLogs).values({
      teamId: options.teamId,
      assignmentId: assignment!.id,
      athleteId: options.athleteId,
      clientId: `test-${assignment!.id}`,
      startedAt,
      finishedAt: new Date(startedAt.getTime() + (entry.durationS ?? 1800) * 1000),
      day,
      durationS: entry.durationS ?? 1800,
      sessionRpe: entry.sessionRpe ?? 5,
      load: entry.load ?? 150,
      pain: entry.pain ?? null,
      painArea: entry.painArea ?? null,
      note: entry.note ?? '',
    }).returning()
    sessions.push({ id: session!.id, day, assignmentId: assignment!.id })
    if (entry.sets?.length) {
      await db.insert(entryLogs).values(entry.sets.map((set, index) => ({
        teamId: options.teamId,
        sessionId: session!.id,
        athleteId: options.athleteId,
        idempotencyKey: `set-${index}`,
        stepId: 'squat',
        exerciseId: options.routine.exerciseId,
        set: index + 1,
        reps: set.reps,
        kg: set.kg,
      })))
    }
  }
  return sessions
}

export async function insertPainFlag(db: Database, options: { teamId: number, athleteId: number, sessionId: number, pain: number, area: string, reason?: 'high_pain' | 'new_area' }) {
  const [flag] = await db.insert(painFlags).values({
    teamId: options.teamId,
    athleteId: options.athleteId,
    sessionId: options.sessionId,
    pain: options.pain,
    area: options.area,
    reason: options.reason ?? 'high_pain',
  }).returning()
  return flag!
}
