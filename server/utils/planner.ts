import { and, asc, eq, inArray } from 'drizzle-orm'
import type { Database } from '../db/client'
import { assignments, memberships, squadMembers, squads, users } from '../db/schema'
import type { AssignmentSnapshot } from '#shared/types/domain'

/** A transaction or the database: anything that can read and write. */
export type Writer = Pick<Database, 'insert' | 'select' | 'update' | 'delete'>

/** The most assignments one request may create; larger plans go in several batches. */
export const MAX_BATCH_ASSIGNMENTS = 2000
const INSERT_CHUNK = 100

export interface PlannedAthlete {
  id: number
  name: string
  email: string
  notifyByEmail: boolean
  timezone: string
}

/** The athletes of the team currently in a squad (coaches who sit in a squad are not assigned work). */
export async function squadAthletes(db: Pick<Database, 'select'>, teamId: number, squadId: number): Promise<number[]> {
  const rows = await db.select({ id: squadMembers.userId }).from(squadMembers)
    .innerJoin(memberships, and(eq(memberships.userId, squadMembers.userId), eq(memberships.teamId, teamId), eq(memberships.role, 'athlete')))
    .where(eq(squadMembers.squadId, squadId))
  return rows.map(row => row.id)
}

export function combineNotes(shared: string, personal?: string) {
  return [shared.trim(), personal?.trim() ?? ''].filter(Boolean).join('\n\n')
}

/**
 * Writes one batch: every athlete gets the snapshot on each of their dates, and each athlete who
 * wants notices gets one e-mail listing their dates. Call it inside a transaction.
 */
export async function insertBatch(tx: Writer, batch: {
  teamId: number
  teamName: string
  coach: { id: number, name: string }
  routine: { id: number, version: number }
  snapshot: AssignmentSnapshot
  seriesId: number | null
  plan: { athlete: PlannedAthlete, dates: string[], note: string }[]
}): Promise<number[]> {
  const rows = batch.plan.flatMap(({ athlete, dates, note }) => dates.map(date => ({
    teamId: batch.teamId,
    athleteId: athlete.id,
    routineId: batch.routine.id,
    routineVersion: batch.routine.version,
    snapshot: batch.snapshot,
    date,
    seriesId: batch.seriesId,
    note,
    assignedById: batch.coach.id,
  })))
  const ids: number[] = []
  for (let start = 0; start < rows.length; start += INSERT_CHUNK) {
    const inserted = await tx.insert(assignments).values(rows.slice(start, start + INSERT_CHUNK)).returning({ id: assignments.id })
    ids.push(...inserted.map(row => row.id))
  }
  const { appUrl } = useServerConfig()
  for (const { athlete, dates, note } of batch.plan) {
    if (!athlete.notifyByEmail || dates.length === 0) continue
    await enqueueEmail(tx, {
      to: athlete.email,
      template: 'assignments_created',
      teamId: batch.teamId,
      payload: {
        athleteName: athlete.name,
        coachName: batch.coach.name,
        teamName: batch.teamName,
        title: batch.snapshot.title,
        dates: [...dates].sort(),
        note,
        url: `${appUrl}/today`,
      },
    })
  }
  return ids
}

/** The team's athletes by id with what notices need; ids outside the team are simply absent. */
export async function athletesById(db: Pick<Database, 'select'>, teamId: number, ids: number[]): Promise<PlannedAthlete[]> {
  if (!ids.length) return []
  return db.select({ id: users.id, name: users.name, email: users.email, notifyByEmail: users.notifyByEmail, timezone: users.timezone })
    .from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, teamId), eq(memberships.role, 'athlete')))
    .where(inArray(users.id, ids))
}

/** The team's athletes with the squads they sit in, for the planner's pickers. */
export async function teamAthletesWithSquads(db: Pick<Database, 'select'>, teamId: number) {
  const [athletes, links] = await Promise.all([
    db.select({ id: users.id, name: users.name })
      .from(memberships).innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'athlete'))).orderBy(asc(users.name)),
    db.select({ squadId: squadMembers.squadId, userId: squadMembers.userId })
      .from(squadMembers).innerJoin(squads, eq(squads.id, squadMembers.squadId)).where(eq(squads.teamId, teamId)),
  ])
  return athletes.map(athlete => ({ ...athlete, squadIds: links.filter(link => link.userId === athlete.id).map(link => link.squadId) }))
}

export async function teamSquads(db: Pick<Database, 'select'>, teamId: number) {
  return db.select({ id: squads.id, name: squads.name }).from(squads).where(eq(squads.teamId, teamId)).orderBy(asc(squads.name))
}
