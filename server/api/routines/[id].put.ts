import { and, eq, sql } from 'drizzle-orm'
import { idParamsSchema } from '#shared/schemas/common'
import { routineUpdateSchema } from '#shared/schemas/routine'
import { routines } from '../../db/schema'

/** Saves the whole routine if nobody saved since `version` was read; a stale save is a 409. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { version, ...input } = await readBodyWith(event, routineUpdateSchema)
  const db = await useDb()
  const current = await findTeamRoutine(db, caller.teamId, id)
  await assertRoutineExercises(db, caller.teamId, input.steps, routineExerciseIds(current.steps))
  const saved = await db.transaction(async (tx) => {
    // The version check is part of the update itself, so two saves racing cannot both win.
    const [row] = await tx.update(routines)
      .set({ ...input, version: sql`${routines.version} + 1`, updatedAt: new Date() })
      .where(and(eq(routines.id, id), eq(routines.teamId, caller.teamId), eq(routines.version, version)))
      .returning()
    if (!row) return null
    await writeRoutineExercises(tx, id, input.steps)
    return row
  })
  if (!saved) {
    const [latest] = await db.select({ version: routines.version, updatedAt: routines.updatedAt }).from(routines)
      .where(and(eq(routines.id, id), eq(routines.teamId, caller.teamId))).limit(1)
    if (!latest) notFound('No such routine')
    refuse(409, 'Someone saved this routine after you opened it', { version: 'This routine changed since you opened it' }, { currentVersion: latest.version, updatedAt: latest.updatedAt })
  }
  return { id: saved.id, version: saved.version, updatedAt: saved.updatedAt }
})
