import { and, count, eq, gte, lt } from 'drizzle-orm'
import { rateEvents } from '../db/schema'

export interface RateRule {
  /** What is counted, e.g. `mail:to:ana@example.test`. */
  key: string
  max: number
  windowMs: number
  /** Said to the caller when this rule is the one that is full. */
  message: string
}

const HOUR = 3600_000

/** How many e-mails a caller may trigger (resets, invites, resends); see docs/security.md. */
export const mailLimits = {
  perRecipient: 5,
  perTeam: 60,
  perAddress: 20,
}

/**
 * The rules for one outgoing e-mail to `to`, triggered from `ip`. A coach's mail (`teamId` given) counts
 * against the team; a signed-out request (a password reset) counts against the client address instead,
 * so a club's coaches sharing one network are not limited by each other.
 */
export function mailRules(to: string, ip: string, teamId?: number): RateRule[] {
  return [
    { key: `mail:to:${to.toLowerCase()}`, max: mailLimits.perRecipient, windowMs: HOUR, message: 'Too many e-mails to this address in the last hour; wait a while before asking again' },
    teamId
      ? { key: `mail:team:${teamId}`, max: mailLimits.perTeam, windowMs: HOUR, message: 'Your team has sent too many e-mails in the last hour; wait a while before sending more' }
      : { key: `mail:ip:${ip}`, max: mailLimits.perAddress, windowMs: HOUR, message: 'Too many e-mails requested from your network in the last hour; wait a while before asking again' },
  ]
}

/**
 * Counts one hit against every rule, or none: 429 with the first full rule's message when any is full.
 * Kept in the database (one write transaction), so the limits hold across app replicas.
 */
export async function takeAllowance(rules: RateRule[]) {
  const db = await useDb()
  const now = Date.now()
  const full = await db.transaction(async (tx) => {
    for (const rule of rules) {
      const [row] = await tx.select({ n: count() }).from(rateEvents)
        .where(and(eq(rateEvents.key, rule.key), gte(rateEvents.at, new Date(now - rule.windowMs))))
      if ((row?.n ?? 0) >= rule.max) return rule
    }
    if (rules.length) await tx.insert(rateEvents).values(rules.map(rule => ({ key: rule.key, at: new Date(now) })))
    return undefined
  }, { behavior: 'immediate' })
  if (full) {
    refuseField('_', full.message, 429)
  }
  // Old hits are swept now and then; a day covers every window above.
  if (Math.random() < 0.05) await db.delete(rateEvents).where(lt(rateEvents.at, new Date(now - 24 * HOUR)))
}
