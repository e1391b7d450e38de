import { eq } from 'drizzle-orm'
import { deleteTeamSchema } from '#shared/schemas/team'
import { assignments, mediaObjects, teams } from '../../db/schema'

/** Deletes the team with all its data, once the head coach has typed its name. */
export default defineEventHandler(async (event) => {
  const caller = await requireHeadCoach(event)
  const input = await readBodyWith(event, deleteTeamSchema)
  if (input.confirmName !== caller.teamName) {
    refuseField('confirmName', 'Type the team\'s name exactly as shown')
  }
  const db = await useDb()
  const media = await db.select({ key: mediaObjects.key }).from(mediaObjects).where(eq(mediaObjects.teamId, caller.teamId))
  await db.transaction(async (tx) => {
    // Assignments hold their routine with ON DELETE RESTRICT, so they go before the cascade reaches routines.
    await tx.delete(assignments).where(eq(assignments.teamId, caller.teamId))
    await tx.delete(teams).where(eq(teams.id, caller.teamId))
  })
  forgetCallers({ teamId: caller.teamId })
  await Promise.all(media.map(object => deleteObjectQuietly(object.key)))
  // Someone who coaches another team carries on there; otherwise they are signed out.
  const [next] = await teamsOf(db, caller.userId)
  if (next) await signIn(event, { id: caller.userId, name: caller.name, email: caller.email }, next.id, next.role)
  else await clearUserSession(event)
  setResponseStatus(event, 204)
  return null
})
