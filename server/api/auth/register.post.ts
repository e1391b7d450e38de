import { eq } from 'drizzle-orm'
import { registerSchema } from '#shared/schemas/auth'
import { memberships, teams, users } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const input = await readBodyWith(event, registerSchema)
  const db = await useDb()
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1)
  const taken = (): never => refuse(409, 'An account with this e-mail already exists', { email: 'An account with this e-mail already exists; sign in instead' })
  if (existing) taken()
  const passwordHash = await hashPassword(input.password)
  // Two registrations at the same moment both pass the check above; the unique index decides.
  const { user, team } = await db.transaction(async (tx) => {
    const [team] = await tx.insert(teams).values({ name: input.teamName }).returning()
    const [user] = await tx.insert(users).values({ name: input.name, email: input.email, passwordHash }).returning()
    await tx.insert(memberships).values({ teamId: team!.id, userId: user!.id, role: 'head_coach' })
    return { user: user!, team: team! }
  }).catch((error: unknown) => {
    if (isUniqueViolation(error)) taken()
    throw error
  })
  await signIn(event, user, team.id, 'head_coach')
  const starterSet = input.starterSet ? await addStarterSet(db, team.id, user.id) : null
  setResponseStatus(event, 201)
  return { user: { id: user.id, name: user.name, email: user.email }, team: { id: team.id, name: team.name }, role: 'head_coach' as const, starterSet }
})
