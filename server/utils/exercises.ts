import { and, eq, ne, sql } from 'drizzle-orm'
import type { Database } from '../db/client'
import { exercises, mediaObjects } from '../db/schema'
import type { ExerciseView } from '../../shared/schemas/exercise'
import type { Caller } from './auth'

type ExerciseRow = typeof exercises.$inferSelect
type MediaRow = typeof mediaObjects.$inferSelect

export function exerciseView(row: ExerciseRow, clip?: Pick<MediaRow, 'contentType' | 'size'> | null): ExerciseView {
  return {
    id: row.id,
    name: row.name,
    category: row.category,
    summary: row.summary,
    cues: row.cues,
    equipment: row.equipment,
    cautions: row.cautions,
    hasClip: row.clipId !== null,
    clip: row.clipId !== null && clip ? { contentType: clip.contentType, size: clip.size } : null,
    hasPoster: row.posterId !== null,
    archivedAt: row.archivedAt ? row.archivedAt.toISOString() : null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  }
}

/** The ids of every exercise in any of the athlete's assignment snapshots (listed or named by a step). */
export async function athleteExerciseIds(db: Database, teamId: number, athleteId: number): Promise<number[]> {
  const rows = await db.all<{ id: number }>(sql`
    SELECT CAST(json_extract(e.value, '$.id') AS INTEGER) AS id
      FROM assignments a, json_each(a.snapshot, '$.exercises') e
     WHERE a.team_id = ${teamId} AND a.athlete_id = ${athleteId}
    UNION
    SELECT CAST(t.value AS INTEGER) AS id
      FROM assignments a, json_tree(a.snapshot, '$.steps') t
     WHERE a.team_id = ${teamId} AND a.athlete_id = ${athleteId} AND t.key = 'exerciseId'`)
  return rows.map(row => Number(row.id)).filter(id => Number.isInteger(id) && id > 0)
}

async function athleteMaySee(db: Database, caller: Caller, exerciseId: number) {
  const [row] = await db.all<{ found: number }>(sql`
    SELECT 1 AS found FROM assignments a
     WHERE a.team_id = ${caller.teamId} AND a.athlete_id = ${caller.userId}
       AND (EXISTS (SELECT 1 FROM json_each(a.snapshot, '$.exercises') e WHERE json_extract(e.value, '$.id') = ${exerciseId})
         OR EXISTS (SELECT 1 FROM json_tree(a.snapshot, '$.steps') t WHERE t.key = 'exerciseId' AND t.value = ${exerciseId}))
     LIMIT 1`)
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
