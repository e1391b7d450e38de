import { idParamsSchema } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const db = await useDb()
  const loaded = await loadBlock(db, caller.teamId, id)
  return blockView(db, caller.teamId, loaded, caller.timezone)
})
