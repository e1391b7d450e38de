import { and, asc, eq, gt, isNull } from 'drizzle-orm'
import { REVIEW_LIMITS } from '#shared/schemas/review'
import { invites, memberships, squadMembers, squads, teams, users } from '../../db/schema'

export default defineEventHandler(async (event) => {
  const caller = await requireCoach(event)
  const db = await useDb()
  const [[settings], members, squadRows, links, pending] = await Promise.all([
    db.select({ emergencyNumber: teams.emergencyNumber, timezone: teams.timezone, reviewRetentionDays: teams.reviewRetentionDays }).from(teams).where(eq(teams.id, caller.teamId)).limit(1),
    db.select({ id: users.id, name: users.name, email: users.email, role: memberships.role, joinedAt: memberships.createdAt })
      .from(memberships).innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.teamId, caller.teamId)).orderBy(asc(users.name)),
    db.select().from(squads).where(eq(squads.teamId, caller.teamId)).orderBy(asc(squads.name)),
    db.select({ squadId: squadMembers.squadId, userId: squadMembers.userId })
      .from(squadMembers).innerJoin(squads, eq(squads.id, squadMembers.squadId)).where(eq(squads.teamId, caller.teamId)),
    db.select({ id: invites.id, email: invites.email, role: invites.role, squadId: invites.squadId, expiresAt: invites.expiresAt, createdAt: invites.createdAt })
      .from(invites)
      .where(and(eq(invites.teamId, caller.teamId), isNull(invites.acceptedAt), isNull(invites.revokedAt), gt(invites.expiresAt, new Date())))
      .orderBy(asc(invites.createdAt)),
  ])
  return {
    team: { id: caller.teamId, name: caller.teamName, emergencyNumber: settings?.emergencyNumber ?? null, timezone: settings?.timezone ?? 'UTC', reviewRetentionDays: settings?.reviewRetentionDays ?? REVIEW_LIMITS.retentionDaysDefault },
    role: caller.role,
    members: members.map(member => ({ ...member, squadIds: links.filter(link => link.userId === member.id).map(link => link.squadId) })),
    squads: squadRows.map(squad => ({ ...squad, memberIds: links.filter(link => link.squadId === squad.id).map(link => link.userId) })),
    invites: pending,
  }
})
