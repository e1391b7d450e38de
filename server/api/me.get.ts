import { eq } from 'drizzle-orm'
import { users } from '../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event)
  const db = await useDb()
  const [row] = await db.select({ welcomedAt: users.welcomedAt }).from(users).where(eq(users.id, caller.userId)).limit(1)
  return {
    user: { id: caller.userId, name: caller.name, email: caller.email, timezone: caller.timezone, welcomed: Boolean(row?.welcomedAt) },
    team: { id: caller.teamId, name: caller.teamName },
    role: caller.role,
  }
})
