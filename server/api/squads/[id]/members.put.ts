import { and, eq } from 'drizzle-orm'
import { squadMembersSchema } from '#shared/schemas/auth'
import { idParamsSchema } from '#shared/schemas/common'
import { squadMembers } from '../../../db/schema'

/** Replaces a squad's athletes; athletes already in it keep their original joining date. */
export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const { id } = paramsWith(event, idParamsSchema)
  const { athleteIds } = await readBodyWith(event, squadMembersSchema)
  const db = await useDb()
  await findTeamSquad(db, caller.teamId, id)
  await assertTeamAthletes(db, caller.teamId, athleteIds)
  await db.transaction(async (tx) => {
    const current = await tx.select({ userId: squadMembers.userId }).from(squadMembers).where(eq(squadMembers.squadId, id))
    const keep = new Set(athleteIds)
    for (const { userId } of current) {
      if (!keep.has(userId)) await tx.delete(squadMembers).where(and(eq(squadMembers.squadId, id), eq(squadMembers.userId, userId)))
    }
    const have = new Set(current.map(row => row.userId))
    const added = athleteIds.filter(athleteId => !have.has(athleteId))
    if (added.length) await tx.insert(squadMembers).values(added.map(userId => ({ squadId: id, userId })))
  })
  return { id, athleteIds }
})
