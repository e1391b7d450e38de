import { blockWeekParamsSchema, overrideInputSchema } from '#shared/schemas/block'
import { addDays, todayIn } from '#shared/utils/dates'
import { baseValue, findStepById } from '#shared/utils/progression'

/** Sets one routine's numbers for one week by hand (an empty list goes back to the rules). */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id, week } = paramsWith(event, blockWeekParamsSchema)
  const input = await readBodyWith(event, overrideInputSchema)
  const db = await useDb()
  const loaded = await loadBlock(db, caller.teamId, id)
  if (week > loaded.block.weeks) refuseField('week', `The block has ${loaded.block.weeks} weeks`)
  const today = todayIn(caller.timezone)
  if (addDays(loaded.block.startDate, week * 7 - 1) < today) refuseField('week', 'This week is over; its sessions stay as they were')
  const slot = loaded.routines.find(item => item.id === input.blockRoutineId)
  if (!slot) refuseField('blockRoutineId', 'This routine slot is not part of the block')
  const [routine] = (await slotRoutines(db, caller.teamId, [slot.routineId], () => 'blockRoutineId')).values()
  input.values.forEach((value, index) => {
    const step = findStepById(routine!.steps, value.stepId)
    if (!step || baseValue(step, value.field) === undefined) refuseField(`values.${index}.field`, 'This step has no such number')
  })
  await saveWeekOverride(db, id, slot.id, week, input.values)
  const updated = loaded.block.plannedAt ? await applyWeekToSessions(db, caller.teamId, id, slot.id, week, today) : 0
  return { updated, ...(await blockView(db, caller.teamId, await loadBlock(db, caller.teamId, id), caller.timezone)) }
})
