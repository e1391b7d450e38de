import { and, eq } from 'drizzle-orm'
import { blocks } from '../../db/schema'
import { blockInputSchema } from '#shared/schemas/block'
import { idParamsSchema } from '#shared/schemas/common'

/** Changes a block's settings. Planned sessions stay as they are until the coach re-plans the weeks ahead. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const input = await readBodyWith(event, blockInputSchema)
  const db = await useDb()
  const { block } = await loadBlock(db, caller.teamId, id)
  if (block.plannedAt && input.startDate !== block.startDate) {
    refuseField('startDate', 'This block is planned; its start cannot move (make a new block instead)')
  }
  await checkBlockInput(db, caller.teamId, input, id)
  await db.transaction(async (tx) => {
    await tx.update(blocks).set({ ...blockValues(input), revision: block.revision + 1 }).where(and(eq(blocks.id, id), eq(blocks.teamId, caller.teamId)))
    await writeBlockParts(tx, id, input)
  })
  const loaded = await loadBlock(db, caller.teamId, id)
  return blockView(db, caller.teamId, loaded, caller.timezone)
})
