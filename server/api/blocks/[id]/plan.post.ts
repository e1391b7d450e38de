import { and, eq } from 'drizzle-orm'
import { blocks } from '../../../db/schema'
import { idParamsSchema } from '#shared/schemas/common'
import { todayIn } from '#shared/utils/dates'
import { ruleProblem } from '#shared/utils/progression'

/**
 * Plans the block: every session with its own week's snapshot, in one transaction, and one notice
 * per athlete. Once planned, planning again rewrites only the weeks that have not started; sessions
 * with a log never change.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const loaded = await loadBlock(db, caller.teamId, id)
  const { block } = loaded
  const replanned = block.plannedAt !== null
  const fromWeek = replanned ? firstFutureWeek(block.startDate, block.weeks, todayIn(caller.timezone)) : 1
  if (fromWeek > block.weeks) {
    refuse(409, 'Every week of this block has started; there are no weeks ahead to plan again')
  }
  if (!loaded.routines.length) refuseField('routines', 'Add at least one routine')
  const athletes = await blockAthletes(db, caller.teamId, loaded.targets)
  if (!athletes.length) refuseField('athleteIds', 'This block has no athletes (its squads are empty)')

  const fieldOf = (routineId: number) => `routines.${loaded.routines.findIndex(slot => slot.routineId === routineId)}.routineId`
  const routinesById = await slotRoutines(db, caller.teamId, loaded.routines.map(slot => slot.routineId), fieldOf)
  // The routines may have changed since the block was saved: check the rules against them again.
  loaded.routines.forEach((slot, index) => slot.rules.forEach((rule, ruleIndex) => {
    const problem = ruleProblem(routinesById.get(slot.routineId)!.steps, rule, block.weeks)
    if (problem) refuseField(`routines.${index}.rules.${ruleIndex}`, `${routinesById.get(slot.routineId)!.title}: ${problem}`)
  }))
  const weeks = computeBlockWeeks(block, slotsOf(loaded), routinesById, overridesOf(loaded), await teamPlateKg(db, caller.teamId))
  assertPlanSize(athletes.length, weeks.filter(week => week.week >= fromWeek).reduce((sum, week) => sum + week.cells.length, 0))

  const { appUrl } = useServerConfig()
  const written = await db.transaction(async (tx) => {
    const result = await writeBlockPlan(tx, { teamId: caller.teamId, coachId: caller.userId, loaded, athletes, weeks, routinesById, fromWeek })
    for (const athlete of athletes) {
      const dates = result.datesByAthlete.get(athlete.id)
      if (!athlete.notifyByEmail || !dates?.length) continue
      await enqueueEmail(tx, {
        to: athlete.email,
        template: 'block_planned',
        teamId: caller.teamId,
        payload: { athleteName: athlete.name, coachName: caller.name, teamName: caller.teamName, blockName: block.name, dates: [...dates].sort(), replanned, url: `${appUrl}/my-block/${block.id}` },
      })
    }
    await tx.update(blocks).set({ plannedAt: new Date(), plannedRevision: block.revision }).where(and(eq(blocks.id, block.id), eq(blocks.teamId, caller.teamId)))
    return result
  })
  return { created: written.created, removed: written.removed, fromWeek, replanned, athletes: athletes.length }
})
