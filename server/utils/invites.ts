import { and, eq } from 'drizzle-orm'
import type { Database } from '../db/client'
import { invites, teams, users } from '../db/schema'

export const INVITE_DAYS = 7

/** Looks up an invite by its token; 404 when unknown, 410 when used, revoked or expired. */
export async function findUsableInvite(db: Database, token: string) {
  const [row] = await db.select({
    invite: invites,
    teamName: teams.name,
    inviterName: users.name,
  }).from(invites)
    .innerJoin(teams, eq(teams.id, invites.teamId))
    .innerJoin(users, eq(users.id, invites.invitedById))
    .where(eq(invites.tokenHash, hashToken(token))).limit(1)
  if (!row) notFound('This invitation link is not valid')
  if (row.invite.acceptedAt || row.invite.revokedAt || row.invite.expiresAt.getTime() < Date.now()) {
    refuse(410, row.invite.acceptedAt ? 'This invitation has already been used' : 'This invitation has expired or was withdrawn; ask your coach for a new one')
  }
  return row
}

/** Issues a fresh token for an invite and queues the e-mail carrying it. */
export async function sendInvite(db: Pick<Database, 'insert' | 'update'>, invite: { id: number, teamId: number, email: string, role: string }, inviterName: string, teamName: string) {
  const { token, hash } = newToken()
  const expiresAt = new Date(Date.now() + INVITE_DAYS * 24 * 3600 * 1000)
  await db.update(invites).set({ tokenHash: hash, expiresAt }).where(and(eq(invites.id, invite.id), eq(invites.teamId, invite.teamId)))
  await enqueueEmail(db, {
    to: invite.email,
    template: 'invite',
    teamId: invite.teamId,
    payload: { inviterName, teamName, role: invite.role, url: `${useServerConfig().appUrl}/join/${token}` },
  })
  return { expiresAt }
}

/** Coaches invite athletes; inviting (or re-sending, withdrawing) a coach's invitation is the head coach's. */
export function assertMayInvite(caller: { role: string }, role: string) {
  if (role !== 'athlete' && caller.role !== 'head_coach') {
    refuse(403, 'Only the head coach can invite coaches')
  }
}
