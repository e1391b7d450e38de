import { and, eq, inArray } from 'drizzle-orm'
import { exercises, routineExercises, routines } from '../server/db/schema'
import { routineStepsSchema, type RoutineStep } from '../shared/schemas/routine-steps'
import { routineExerciseIds } from '../server/utils/routines'
import type { SeedStep } from './context'
import { starterTemplates as templates } from '../server/starter/routines'
import { starterSlug } from '../server/starter/exercises'

/** Strip `exerciseId: undefined` and `note: undefined` so the stored tree is what the schema returns. */
function clean(steps: RoutineStep[]): RoutineStep[] {
  return routineStepsSchema.parse(JSON.parse(JSON.stringify(steps)))
}

export const seedRoutines: SeedStep = async ({ db, teamId, users, log }) => {
  const names = [...new Set(templates.flatMap(template => [...template.needs, ...(template.uses ?? [])]))]
  const found = await db.select({ id: exercises.id, name: exercises.name }).from(exercises)
    .where(and(eq(exercises.teamId, teamId), inArray(exercises.name, names)))
  const byName = new Map(found.map(row => [row.name, row.id]))
  const exercise = (name: string) => byName.get(name)

  for (const template of templates) {
    const [existing] = await db.select({ id: routines.id }).from(routines)
      .where(and(eq(routines.teamId, teamId), eq(routines.title, template.title))).limit(1)
    if (existing) continue
    const missing = template.needs.filter(name => !byName.has(name))
    if (missing.length) {
      log(`no "${template.title}" yet: the library lacks ${missing.join(', ')}`)
      continue
    }
    const steps = clean(template.steps(exercise))
    await db.transaction(async (tx) => {
      const [routine] = await tx.insert(routines).values({
        teamId,
        title: template.title,
        category: template.category,
        description: template.description,
        steps,
        isTemplate: true,
        starterKey: starterSlug(template.title),
        createdById: users.headCoach,
      }).returning({ id: routines.id })
      const ids = routineExerciseIds(steps)
      if (ids.length) await tx.insert(routineExercises).values(ids.map(exerciseId => ({ routineId: routine!.id, exerciseId })))
    })
    log(`routine template "${template.title}"`)
  }
}
