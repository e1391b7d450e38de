import { and, asc, desc, eq, gte, inArray, lte } from 'drizzle-orm'
import type { Database } from '../db/client'
import { assignments, entryLogs, sessionLogs } from '../db/schema'
import { stepNamesById } from '#shared/utils/routine-text'

/** One athlete's sessions with their entries, newest first, optionally between two days. */
export async function loadLogbook(db: Database, teamId: number, athleteId: number, range: { from?: string, to?: string }, limit = 200) {
  const conditions = [eq(sessionLogs.teamId, teamId), eq(sessionLogs.athleteId, athleteId)]
  if (range.from) conditions.push(gte(sessionLogs.day, range.from))
  if (range.to) conditions.push(lte(sessionLogs.day, range.to))
  const sessions = await db.select({ session: sessionLogs, snapshot: assignments.snapshot, date: assignments.date, status: assignments.status })
    .from(sessionLogs)
    .innerJoin(assignments, eq(assignments.id, sessionLogs.assignmentId))
    .where(and(...conditions))
    .orderBy(desc(sessionLogs.startedAt))
    .limit(limit)
  const ids = sessions.map(row => row.session.id)
  const entries = ids.length
    ? await db.select().from(entryLogs).where(and(eq(entryLogs.teamId, teamId), inArray(entryLogs.sessionId, ids))).orderBy(asc(entryLogs.id))
    : []
  return sessions.map(({ session, snapshot, date, status }) => {
    const names = new Map(snapshot.exercises.map(exercise => [exercise.id, exercise.name]))
    const stepNames = stepNamesById(snapshot.steps, id => names.get(id))
    return {
      ...sessionView(session),
      routine: { title: snapshot.title, category: snapshot.category },
      assignment: { id: session.assignmentId, date, status },
      entries: entries.filter(entry => entry.sessionId === session.id).map(entry => ({
        ...entryView(entry),
        exerciseName: entry.exerciseId ? (names.get(entry.exerciseId) ?? null) : null,
        /** What the athlete saw for the step: the exercise or the kind of step, never the step id. */
        label: (entry.exerciseId ? names.get(entry.exerciseId) : undefined) ?? stepNames.get(entry.stepId) ?? 'A step',
      })),
    }
  })
}
