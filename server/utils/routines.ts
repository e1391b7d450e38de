import { and, asc, eq, inArray } from 'drizzle-orm'
import type { Database } from '../db/client'
import { clipCues, exercises, routineExercises, routines } from '../db/schema'
import type { RoutineStep } from '#shared/schemas/routine-steps'
import { exerciseListColumns } from './exercises'

type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0]

export interface ExerciseRef {
  /** Dotted path of the step, e.g. `steps.2.steps.0`, matching the keys of `data.fields`. */
  path: string
  exerciseId: number
}

/** Every exercise a step tree names, with the path of the step that names it. */
export function routineExerciseRefs(steps: RoutineStep[], prefix = 'steps'): ExerciseRef[] {
  return steps.flatMap((step, index) => {
    const path = `${prefix}.${index}`
    if (step.type === 'repeat') return routineExerciseRefs(step.steps, `${path}.steps`)
    return step.exerciseId ? [{ path, exerciseId: step.exerciseId }] : []
  })
}

export function routineExerciseIds(steps: RoutineStep[]): number[] {
  return [...new Set(routineExerciseRefs(steps).map(ref => ref.exerciseId))]
}

/**
 * Every exercise in the tree must be in the caller's library. Archived exercises may stay where a
 * routine already used them (`keepArchived`), but cannot be newly added. A 400 names each bad step.
 */
export async function assertRoutineExercises(db: Database, teamId: number, steps: RoutineStep[], keepArchived: number[] = []) {
  const refs = routineExerciseRefs(steps)
  if (refs.length === 0) return
  const ids = [...new Set(refs.map(ref => ref.exerciseId))]
  const rows = await db.select({ id: exercises.id, archivedAt: exercises.archivedAt }).from(exercises)
    .where(and(eq(exercises.teamId, teamId), inArray(exercises.id, ids)))
  const found = new Map(rows.map(row => [row.id, row]))
  const fields: Record<string, string> = {}
  for (const ref of refs) {
    const row = found.get(ref.exerciseId)
    if (!row) fields[`${ref.path}.exerciseId`] ??= 'This exercise is not in your library'
    else if (row.archivedAt && !keepArchived.includes(ref.exerciseId)) fields[`${ref.path}.exerciseId`] ??= 'This exercise is archived; pick another one'
  }
  if (Object.keys(fields).length) refuseFields(fields)
}

/** The "where used" index of a routine, rewritten with each save inside the caller's transaction. */
export async function writeRoutineExercises(tx: Transaction, routineId: number, steps: RoutineStep[]) {
  await tx.delete(routineExercises).where(eq(routineExercises.routineId, routineId))
  const ids = routineExerciseIds(steps)
  if (ids.length) await tx.insert(routineExercises).values(ids.map(exerciseId => ({ routineId, exerciseId })))
}

export async function findTeamRoutine(db: Database, teamId: number, id: number) {
  const [routine] = await db.select().from(routines).where(and(eq(routines.id, id), eq(routines.teamId, teamId))).limit(1)
  if (!routine) notFound('No such routine')
  return routine
}

/** What the builder, preview and print card show of each exercise a routine uses. */
export async function routineExerciseDetails(db: Database, teamId: number, steps: RoutineStep[]) {
  const ids = routineExerciseIds(steps)
  if (ids.length === 0) return []
  const rows = await db.select(exerciseListColumns).from(exercises).where(and(eq(exercises.teamId, teamId), inArray(exercises.id, ids)))
  // The cues pinned to moments of each clip, for the print card's numbered list with times.
  const pinned = await db.select({ exerciseId: clipCues.exerciseId, startSeconds: clipCues.startSeconds, text: clipCues.text })
    .from(clipCues).where(and(eq(clipCues.teamId, teamId), inArray(clipCues.exerciseId, ids)))
    .orderBy(asc(clipCues.startSeconds), asc(clipCues.id))
  return rows.map(({ clipId, ...row }) => ({
    ...row,
    hasClip: clipId !== null,
    clipCues: clipId === null ? [] : pinned.filter(cue => cue.exerciseId === row.id).map(({ startSeconds, text }) => ({ startSeconds, text })),
  }))
}

export function publicRoutine(routine: typeof routines.$inferSelect) {
  return {
    id: routine.id,
    title: routine.title,
    category: routine.category,
    description: routine.description,
    steps: routine.steps,
    version: routine.version,
    isTemplate: routine.isTemplate,
    archivedAt: routine.archivedAt,
    createdAt: routine.createdAt,
    updatedAt: routine.updatedAt,
  }
}
