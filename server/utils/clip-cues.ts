import { and, asc, count, eq } from 'drizzle-orm'
import type { Database } from '../db/client'
import { clipCues } from '../db/schema'
import { cueTimeProblems, type ClipCueView } from '#shared/schemas/clip-cue'

type CueRow = typeof clipCues.$inferSelect

export function clipCueView(row: CueRow): ClipCueView {
  return { id: row.id, startSeconds: row.startSeconds, endSeconds: row.endSeconds, text: row.text }
}

export async function listClipCues(db: Database, teamId: number, exerciseId: number) {
  return db.select().from(clipCues)
    .where(and(eq(clipCues.teamId, teamId), eq(clipCues.exerciseId, exerciseId)))
    .orderBy(asc(clipCues.startSeconds), asc(clipCues.id))
}

export async function countClipCues(db: Pick<Database, 'select'>, teamId: number, exerciseId: number) {
  const [row] = await db.select({ total: count() }).from(clipCues)
    .where(and(eq(clipCues.teamId, teamId), eq(clipCues.exerciseId, exerciseId)))
  return row?.total ?? 0
}

/** 400 naming the field when a cue's times do not fit the clip. */
export function assertCueFits(cue: { startSeconds: number, endSeconds: number | null }, durationSeconds: number | null) {
  const fields = cueTimeProblems(cue, durationSeconds)
  if (Object.keys(fields).length) refuseFields(fields)
}

/** The team's exercise with a clip, for cue changes: 404 without one, since cues are pinned to a clip. */
export async function findExerciseWithClip(db: Database, caller: Parameters<typeof findTeamExercise>[1], exerciseId: number) {
  const found = await findTeamExercise(db, caller, exerciseId)
  if (!found.exercise.clipId || !found.clip) notFound('This exercise has no clip to pin cues to')
  return { exercise: found.exercise, clip: found.clip }
}
