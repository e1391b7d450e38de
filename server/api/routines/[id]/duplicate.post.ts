import { idParamsSchema } from '#shared/schemas/common'
import { routineDuplicateSchema } from '#shared/schemas/routine'
import { routines } from '../../../db/schema'

/** A new routine with the same steps, starting at version 1 (templates are copied this way too). */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const input = await readBodyWith(event, routineDuplicateSchema)
  const db = await useDb()
  const source = await findTeamRoutine(db, caller.teamId, id)
  const title = input.title ?? `${source.title} (copy)`.slice(0, 120)
  const copy = await db.transaction(async (tx) => {
    const [created] = await tx.insert(routines).values({
      teamId: caller.teamId,
      title,
      category: source.category,
      description: source.description,
      steps: source.steps,
      createdById: caller.userId,
    }).returning()
    await writeRoutineExercises(tx, created!.id, source.steps)
    return created!
  })
  setResponseStatus(event, 201)
  return { id: copy.id, version: copy.version, title: copy.title }
})
