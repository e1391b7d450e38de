import { and, eq, sql } from 'drizzle-orm'
import type { Database } from '../db/client'
import { emailOutbox } from '../db/schema'
import { todayIn } from '#shared/utils/dates'
import type { PlannedAthlete } from './planner'

export interface PlanChange {
  kind: 'moved' | 'removed' | 'added'
  title: string
  from?: string
  to?: string
  /** Several sessions of a weekly series removed at once, from `from` on. */
  count?: number
}

/**
 * Queues a notice of a moved, removed or added session. Changes for one athlete on one day (in their
 * time zone) gather in one message that waits `PLAN_NOTICE_DELAY_MS` for more before it goes out;
 * athletes who turned notices off get none.
 */
export async function queuePlanChange(tx: Pick<Database, 'select' | 'update' | 'insert'>, notice: { teamId: number, teamName: string, athlete: PlannedAthlete, change: PlanChange }) {
  const { athlete, change } = notice
  if (!athlete.notifyByEmail) return
  const day = todayIn(athlete.timezone)
  const [pending] = await tx.select({ id: emailOutbox.id, payload: emailOutbox.payload }).from(emailOutbox).where(and(
    eq(emailOutbox.to, athlete.email),
    eq(emailOutbox.template, 'plan_changes'),
    eq(emailOutbox.teamId, notice.teamId),
    eq(emailOutbox.status, 'pending'),
    sql`json_extract(${emailOutbox.payload}, '$.day') = ${day}`,
  )).limit(1)
  if (pending) {
    const changes = [...((pending.payload.changes as PlanChange[] | undefined) ?? []), change]
    // Only while still pending: once the worker has claimed it, the change starts a new message.
    const updated = await tx.update(emailOutbox).set({ payload: { ...pending.payload, changes } })
      .where(and(eq(emailOutbox.id, pending.id), eq(emailOutbox.status, 'pending'))).returning({ id: emailOutbox.id })
    if (updated.length) return
  }
  const payload = { athleteName: athlete.name, teamName: notice.teamName, day, changes: [change], url: `${useServerConfig().appUrl}/today` }
  renderEmail('plan_changes', payload)
  await tx.insert(emailOutbox).values({
    to: athlete.email,
    template: 'plan_changes',
    teamId: notice.teamId,
    payload,
    nextAttemptAt: new Date(Date.now() + useServerConfig().planNoticeDelayMs),
  })
}
