import { and, eq, inArray } from 'drizzle-orm'
import type { Database } from '../db/client'
import { exercises, routines } from '../db/schema'
import type { AssignmentSnapshot } from '#shared/types/domain'
import type { RoutineStep } from '#shared/schemas/routine-steps'

type Reader = Pick<Database, 'select'>

/** Every exercise id a step tree refers to, in first-use order. */
export function exerciseIdsIn(steps: RoutineStep[]): number[] {
  const ids: number[] = []
  const visit = (list: RoutineStep[]) => {
    for (const step of list) {
      if (step.type === 'repeat') visit(step.steps)
      else if (step.exerciseId && !ids.includes(step.exerciseId)) ids.push(step.exerciseId)
    }
  }
  visit(steps)
  return ids
}

/**
 * A routine as it is now, with the exercises it uses, frozen for an assignment.
 * 404 for another team's routine (or none), 400 for an archived one.
 * Imports what it uses explicitly so the seeds (plain Node) can call it too.
 */
export async function snapshotRoutine(db: Reader, teamId: number, routineId: number, field = 'routineId') {
  const [routine] = await db.select().from(routines).where(and(eq(routines.id, routineId), eq(routines.teamId, teamId))).limit(1)
  if (!routine) notFound('No such routine')
  if (routine.archivedAt) {
    refuseField(field, 'This routine is archived; restore it before assigning it')
  }
  const ids = exerciseIdsIn(routine.steps)
  const rows = ids.length
    ? await db.select().from(exercises).where(and(eq(exercises.teamId, teamId), inArray(exercises.id, ids)))
    : []
  const byId = new Map(rows.map(row => [row.id, row]))
  const snapshot: AssignmentSnapshot = {
    title: routine.title,
    category: routine.category,
    description: routine.description,
    steps: routine.steps,
    exercises: ids.flatMap((id) => {
      const exercise = byId.get(id)
      return exercise
        ? [{ id, name: exercise.name, category: exercise.category, summary: exercise.summary, cues: exercise.cues, equipment: exercise.equipment, cautions: exercise.cautions }]
        : []
    }),
  }
  return { routine, snapshot }
}
