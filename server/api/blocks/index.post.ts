import { blocks } from '../../db/schema'
import { blockInputSchema } from '#shared/schemas/block'

/** Saves a block (not yet planned: planning is its own step, after the preview). */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const input = await readBodyWith(event, blockInputSchema)
  const db = await useDb()
  await checkBlockInput(db, caller.teamId, input)
  const id = await db.transaction(async (tx) => {
    const [row] = await tx.insert(blocks).values({ teamId: caller.teamId, ...blockValues(input), createdById: caller.userId }).returning({ id: blocks.id })
    await writeBlockParts(tx, row!.id, input)
    return row!.id
  })
  setResponseStatus(event, 201)
  return { id }
})
