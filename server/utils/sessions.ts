import { and, eq, sql } from 'drizzle-orm'
import type { Database } from '../db/client'
import { assignments, entryLogs, memberships, sessionLogs, users } from '../db/schema'
import type { Caller } from './auth'
import { EDIT_WINDOW_DAYS } from '#shared/schemas/session'

/** An assignment of the calling athlete; anyone else's (or another team's) is a 404. */
export async function findOwnAssignment(db: Database, caller: Caller, id: number) {
  const [row] = await db.select().from(assignments)
    .where(and(eq(assignments.id, id), eq(assignments.teamId, caller.teamId), eq(assignments.athleteId, caller.userId)))
    .limit(1)
  if (!row) notFound('No such assignment')
  return row
}

// Every set an athlete logs looks its session up first: built once, not on every request.
const ownSessionFor = builtOnce(db => db.select().from(sessionLogs)
  .where(and(eq(sessionLogs.id, sql.placeholder('id')), eq(sessionLogs.teamId, sql.placeholder('teamId')), eq(sessionLogs.athleteId, sql.placeholder('athleteId'))))
  .limit(1)
  .prepare())

/** A session the caller logs into: their own. */
export async function findOwnSession(db: Database, caller: Caller, id: number) {
  const row = await ownSessionFor(db).get({ id, teamId: caller.teamId, athleteId: caller.userId })
  if (!row) notFound('No such session')
  return row
}

/** A session the caller may read: their own, or any of the team's when they coach it. */
export async function findReadableSession(db: Database, caller: Caller, id: number) {
  const conditions = [eq(sessionLogs.id, id), eq(sessionLogs.teamId, caller.teamId)]
  if (!isCoachRole(caller.role)) conditions.push(eq(sessionLogs.athleteId, caller.userId))
  const [row] = await db.select().from(sessionLogs).where(and(...conditions)).limit(1)
  if (!row) notFound('No such session')
  return row
}

export function editableUntil(session: { startedAt: Date }) {
  return new Date(session.startedAt.getTime() + EDIT_WINDOW_DAYS * 86_400_000)
}

export function assertEditable(session: { startedAt: Date }) {
  if (Date.now() > editableUntil(session).getTime()) {
    refuseField('_', `Sessions can be changed for ${EDIT_WINDOW_DAYS} days after they start`, 409)
  }
}

export type EntryRow = typeof entryLogs.$inferSelect

export function entryView(entry: EntryRow) {
  return {
    id: entry.id,
    sessionId: entry.sessionId,
    idempotencyKey: entry.idempotencyKey,
    stepId: entry.stepId,
    exerciseId: entry.exerciseId,
    set: entry.set,
    round: entry.round,
    reps: entry.reps,
    kg: entry.kg,
    seconds: entry.seconds,
    meters: entry.meters,
    rpe: entry.rpe,
    createdAt: entry.createdAt,
  }
}

export function sessionView(session: typeof sessionLogs.$inferSelect) {
  return {
    id: session.id,
    assignmentId: session.assignmentId,
    athleteId: session.athleteId,
    clientId: session.clientId,
    startedAt: session.startedAt,
    finishedAt: session.finishedAt,
    day: session.day,
    durationS: session.durationS,
    sessionRpe: session.sessionRpe,
    load: session.load,
    pain: session.pain,
    painArea: session.painArea,
    note: session.note,
    editableUntil: editableUntil(session),
  }
}

/** An athlete of the caller's team, or a 404. */
export async function findTeamAthlete(db: Database, teamId: number, athleteId: number) {
  const [row] = await db.select({ id: users.id, name: users.name, email: users.email, timezone: users.timezone })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId), eq(memberships.role, 'athlete')))
    .where(eq(users.id, athleteId)).limit(1)
  if (!row) notFound('No such athlete')
  return row
}

/**
 * Entries may arrive after a session was finished (the player's offline queue sends them late); they
 * are accepted within the edit window and the assignment's done/partial status is worked out again.
 */
export async function refreshFinishedStatus(db: Database, teamId: number, session: { id: number, assignmentId: number, finishedAt: Date | null }) {
  if (!session.finishedAt) return
  const [assignment] = await db.select({ id: assignments.id, snapshot: assignments.snapshot, status: assignments.status }).from(assignments)
    .where(and(eq(assignments.id, session.assignmentId), eq(assignments.teamId, teamId))).limit(1)
  if (!assignment || (assignment.status !== 'done' && assignment.status !== 'partial')) return
  const entries = await db.select({ stepId: entryLogs.stepId, set: entryLogs.set, round: entryLogs.round }).from(entryLogs).where(eq(entryLogs.sessionId, session.id))
  const logged = new Set(entries.map(entry => segmentKey(entry)))
  const status = loggableKeys(assignment.snapshot).every(segment => logged.has(segment.key)) ? 'done' : 'partial'
  if (status !== assignment.status) await db.update(assignments).set({ status }).where(and(eq(assignments.id, assignment.id), eq(assignments.teamId, teamId)))
}
