import { and, eq, ne, sql } from 'drizzle-orm'
import type { Database } from '../db/client'
import { assignments, exercises, mediaObjects } from '../db/schema'
import type { ExerciseView } from '#shared/schemas/exercise'
import type { Caller } from './auth'

type ExerciseRow = typeof exercises.$inferSelect
type MediaRow = typeof mediaObjects.$inferSelect

export function exerciseView(row: Pick<ExerciseRow, 'id' | 'name' | 'category' | 'summary' | 'cues' | 'equipment' | 'cautions' | 'clipId' | 'posterId' | 'archivedAt' | 'createdAt' | 'updatedAt'>, clip?: Pick<MediaRow, 'contentType' | 'size'> & Partial<Pick<MediaRow, 'durationSeconds' | 'width' | 'height'>> | null): ExerciseView {
  return {
    id: row.id,
    name: row.name,
    category: row.category,
    summary: row.summary,
    cues: row.cues,
    equipment: row.equipment,
    cautions: row.cautions,
    hasClip: row.clipId !== null,
    clip: row.clipId !== null && clip
      ? { contentType: clip.contentType, size: clip.size, durationSeconds: clip.durationSeconds ?? null, width: clip.width ?? null, height: clip.height ?? null }
      : null,
    hasPoster: row.posterId !== null,
    archivedAt: row.archivedAt ? row.archivedAt.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  }
}

/** What a listing of exercises reads for each one: the library, and the exercises a routine uses. */
export const exerciseListColumns = {
  id: exercises.id,
  name: exercises.name,
  category: exercises.category,
  summary: exercises.summary,
  cues: exercises.cues,
  equipment: exercises.equipment,
  cautions: exercises.cautions,
  clipId: exercises.clipId,
  archivedAt: exercises.archivedAt,
}

/** The ids of every exercise in any of the athlete's assignment snapshots (listed or named by a step). */
export async function athleteExerciseIds(db: Database, teamId: number, athleteId: number): Promise<number[]> {
  // Snapshots are JSON in one column: SQLite's json_each/json_tree read the lists and steps in place.
  const own = and(eq(assignments.teamId, teamId), eq(assignments.athleteId, athleteId))
  const rows = await db.all<{ id: number }>(sql`
    SELECT CAST(json_extract(listed.value, '$.id') AS INTEGER) AS id
      FROM ${assignments}, json_each(${assignments.snapshot}, '$.exercises') AS listed
     WHERE ${own}
    UNION
    SELECT CAST(step.value AS INTEGER) AS id
      FROM ${assignments}, json_tree(${assignments.snapshot}, '$.steps') AS step
     WHERE ${own} AND step.key = 'exerciseId'`)
  return rows.map(row => Number(row.id)).filter(id => Number.isInteger(id) && id > 0)
}

/** Whether an assignment's snapshot lists the exercise or names it in a step. */
export function snapshotUsesExercise(exerciseId: number) {
  return sql`(EXISTS (SELECT 1 FROM json_each(${assignments.snapshot}, '$.exercises') AS listed WHERE json_extract(listed.value, '$.id') = ${exerciseId})
    OR EXISTS (SELECT 1 FROM json_tree(${assignments.snapshot}, '$.steps') AS step WHERE step.key = 'exerciseId' AND step.value = ${exerciseId}))`
}

async function athleteMaySee(db: Database, caller: Caller, exerciseId: number) {
  const [row] = await db.select({ id: assignments.id }).from(assignments)
    .where(and(eq(assignments.teamId, caller.teamId), eq(assignments.athleteId, caller.userId), snapshotUsesExercise(exerciseId)))
    .limit(1)
  return Boolean(row)
}

/**
 * The team's exercise with its clip record, or a 404. Athletes only reach exercises that appear in
 * their own assignments; for anything else they get the same 404 as for another team's id.
 */
export async function findTeamExercise(db: Database, caller: Caller, exerciseId: number) {
  const [found] = await db.select({ exercise: exercises, clip: mediaObjects })
    .from(exercises)
    .leftJoin(mediaObjects, eq(mediaObjects.id, exercises.clipId))
    .where(and(eq(exercises.id, exerciseId), eq(exercises.teamId, caller.teamId)))
    .limit(1)
  if (!found) notFound('No such exercise')
  if (!isCoachRole(caller.role) && !(await athleteMaySee(db, caller, exerciseId))) notFound('No such exercise')
  return found
}

/** 409 with a field message when another exercise of the team already has this name. */
export async function assertExerciseNameFree(db: Database, teamId: number, name: string, exceptId?: number) {
  const [clash] = await db.select({ id: exercises.id }).from(exercises)
    .where(and(
      eq(exercises.teamId, teamId),
      sql`lower(${exercises.name}) = lower(${name})`,
      exceptId ? ne(exercises.id, exceptId) : undefined,
    ))
    .limit(1)
  if (clash) {
    refuseField('name', 'Your library already has an exercise with this name', 409)
  }
}
