import { and, eq, isNull } from 'drizzle-orm'
import { acceptInviteSchema, tokenParamsSchema } from '#shared/schemas/auth'
import { athleteProfiles, invites, memberships, squadMembers, users } from '../../../db/schema'

export default defineEventHandler(async (event) => {
  const { token } = paramsWith(event, tokenParamsSchema)
  const input = await readBodyWith(event, acceptInviteSchema)
  const db = await useDb()
  const { invite, teamName } = await findUsableInvite(db, token)
  const [existing] = await db.select().from(users).where(eq(users.email, invite.email)).limit(1)
  if (existing && !(await verifyPassword(existing.passwordHash, input.password))) {
    refuse(401, 'This e-mail already has a Switchback account: enter its password to join', { password: 'Enter the password of your existing account' })
  }
  const passwordHash = existing ? undefined : await hashPassword(input.password)
  const user = await db.transaction(async (tx) => {
    // Claiming the invite first makes a second, simultaneous accept fail instead of joining twice.
    const claimed = await tx.update(invites).set({ acceptedAt: new Date() })
      .where(and(eq(invites.id, invite.id), isNull(invites.acceptedAt), isNull(invites.revokedAt))).returning({ id: invites.id })
    if (claimed.length === 0) refuse(410, 'This invitation has already been used')
    const user = existing ?? (await tx.insert(users).values({ name: input.name, email: invite.email, passwordHash: passwordHash! }).returning())[0]!
    await tx.insert(memberships).values({ teamId: invite.teamId, userId: user.id, role: invite.role }).onConflictDoNothing()
    if (invite.role === 'athlete') {
      await tx.insert(athleteProfiles).values({ userId: user.id, teamId: invite.teamId }).onConflictDoNothing()
      if (invite.squadId) await tx.insert(squadMembers).values({ squadId: invite.squadId, userId: user.id }).onConflictDoNothing()
    }
    return user
  }).catch((error: unknown) => {
    // An account for this e-mail was registered at the same moment.
    if (isUniqueViolation(error)) refuse(409, 'An account with this e-mail was just created; accept the invitation again with its password', { password: 'Enter the password of your existing account' })
    throw error
  })
  await signIn(event, user, invite.teamId, invite.role)
  setResponseStatus(event, 201)
  return { user: { id: user.id, name: user.name, email: user.email }, team: { id: invite.teamId, name: teamName }, role: invite.role }
})
