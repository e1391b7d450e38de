import { and, eq } from 'drizzle-orm'
import { inviteSchema } from '#shared/schemas/auth'
import { invites, memberships, squads, users } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const input = await readBodyWith(event, inviteSchema)
  assertMayInvite(caller, input.role)
  const db = await useDb()
  if (input.squadId) {
    const [squad] = await db.select({ id: squads.id }).from(squads).where(and(eq(squads.id, input.squadId), eq(squads.teamId, caller.teamId))).limit(1)
    if (!squad) refuseField('squadId', 'No such squad in your team')
  }
  const [member] = await db.select({ id: users.id }).from(users)
    .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.teamId, caller.teamId)))
    .where(eq(users.email, input.email)).limit(1)
  if (member) {
    refuse(409, 'This person is already in your team', { email: 'This person is already in your team' })
  }
  await takeAllowance(mailRules(input.email, clientAddress(event), caller.teamId))
  const invite = await db.transaction(async (tx) => {
    const [invite] = await tx.insert(invites).values({
      teamId: caller.teamId,
      email: input.email,
      role: input.role,
      squadId: input.squadId ?? null,
      tokenHash: newToken().hash,
      invitedById: caller.userId,
      expiresAt: new Date(),
    }).returning()
    const { expiresAt } = await sendInvite(tx, invite!, caller.name, caller.teamName)
    return { ...invite!, expiresAt }
  })
  setResponseStatus(event, 201)
  return { id: invite.id, email: invite.email, role: invite.role, squadId: invite.squadId, expiresAt: invite.expiresAt }
})
