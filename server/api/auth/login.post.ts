import { desc, eq } from 'drizzle-orm'
import { loginSchema } from '#shared/schemas/auth'
import { memberships, teams, users } from '../../db/schema'

const wrong = () => refuse(401, 'E-mail or password is wrong')

export default defineEventHandler(async (event) => {
  const input = await readBodyWith(event, loginSchema)
  const ip = clientAddress(event)
  await assertLoginAllowed(input.email, ip)
  const db = await useDb()
  const [user] = await db.select().from(users).where(eq(users.email, input.email)).limit(1)
  const valid = user ? await verifyPassword(user.passwordHash, input.password) : await verifyAgainstDummy(input.password)
  if (!user || !valid) {
    await recordLoginFailure(input.email, ip)
    throw wrong()
  }
  const [membership] = await db.select({ teamId: memberships.teamId, role: memberships.role, teamName: teams.name })
    .from(memberships).innerJoin(teams, eq(teams.id, memberships.teamId))
    .where(eq(memberships.userId, user.id)).orderBy(desc(memberships.createdAt)).limit(1)
  if (!membership) throw wrong()
  await clearLoginFailures(input.email, ip)
  await signIn(event, user, membership.teamId, membership.role)
  return { user: { id: user.id, name: user.name, email: user.email }, team: { id: membership.teamId, name: membership.teamName }, role: membership.role }
})
