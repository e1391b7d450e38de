import { eq } from 'drizzle-orm'
import { registerSchema } from '#shared/schemas/auth'
import { memberships, teams, users } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const input = await readBodyWith(event, registerSchema)
  const db = await useDb()
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1)
  if (existing) {
    refuse(409, 'An account with this e-mail already exists', { email: 'An account with this e-mail already exists; sign in instead' })
  }
  const passwordHash = await hashPassword(input.password)
  const { user, team } = await db.transaction(async (tx) => {
    const [team] = await tx.insert(teams).values({ name: input.teamName }).returning()
    const [user] = await tx.insert(users).values({ name: input.name, email: input.email, passwordHash }).returning()
    await tx.insert(memberships).values({ teamId: team!.id, userId: user!.id, role: 'head_coach' })
    return { user: user!, team: team! }
  })
  await signIn(event, user, team.id, 'head_coach')
  setResponseStatus(event, 201)
  return { user: { id: user.id, name: user.name, email: user.email }, team: { id: team.id, name: team.name }, role: 'head_coach' as const }
})
