import { and, count, eq, gte, lt } from 'drizzle-orm'
import type { H3Event } from 'h3'
import { loginFailures } from '../db/schema'

const WINDOW_MS = 15 * 60 * 1000
/** Failures of one account from one address before that address is refused for this account. */
const MAX_PER_EMAIL_AND_ADDRESS = 5
/** Failures from one address, whatever the accounts, before the address is refused. */
const MAX_PER_ADDRESS = 30
/** Failures of one account from all addresses after which each attempt is slowed down. */
const SLOW_AFTER_PER_EMAIL = 5
const MAX_DELAY_MS = 4000

export function clientAddress(event: H3Event) {
  return getRequestIP(event, { xForwardedFor: useServerConfig().trustProxy }) ?? 'unknown'
}

/** The wait before checking a password of an account with `failures` recent failures (0 for the first few). */
export function loginDelayMs(failures: number) {
  if (failures < SLOW_AFTER_PER_EMAIL) return 0
  return Math.min(250 * 2 ** (failures - SLOW_AFTER_PER_EMAIL), MAX_DELAY_MS)
}

/**
 * 429 once this address has failed too often for this account, or too often overall. Failures of an
 * account from other addresses never lock it; they only slow each attempt down (progressive delay),
 * so a stranger cannot lock a real person out.
 */
export async function assertLoginAllowed(email: string, ip: string) {
  const db = await useDb()
  const since = new Date(Date.now() - WINDOW_MS)
  const [[byPair], [byAddress], [byEmail]] = await Promise.all([
    db.select({ n: count() }).from(loginFailures).where(and(eq(loginFailures.email, email), eq(loginFailures.ip, ip), gte(loginFailures.at, since))),
    db.select({ n: count() }).from(loginFailures).where(and(eq(loginFailures.ip, ip), gte(loginFailures.at, since))),
    db.select({ n: count() }).from(loginFailures).where(and(eq(loginFailures.email, email), gte(loginFailures.at, since))),
  ])
  if ((byPair?.n ?? 0) >= MAX_PER_EMAIL_AND_ADDRESS || (byAddress?.n ?? 0) >= MAX_PER_ADDRESS) {
    refuse(429, 'Too many failed sign-ins. Wait 15 minutes or reset your password.')
  }
  const delay = loginDelayMs(byEmail?.n ?? 0)
  if (delay) await new Promise(resolve => setTimeout(resolve, delay))
}

export async function recordLoginFailure(email: string, ip: string) {
  const db = await useDb()
  await db.insert(loginFailures).values({ email, ip, at: new Date() })
  await db.delete(loginFailures).where(lt(loginFailures.at, new Date(Date.now() - WINDOW_MS)))
}

/** After a success from `ip` (or, without `ip`, a password reset), forget the account's failures there. */
export async function clearLoginFailures(email: string, ip?: string) {
  const db = await useDb()
  await db.delete(loginFailures).where(ip ? and(eq(loginFailures.email, email), eq(loginFailures.ip, ip)) : eq(loginFailures.email, email))
}

let dummyHash: Promise<string> | undefined

/**
 * Checks a password against a throwaway hash, so a sign-in with an unknown e-mail takes as long as one
 * with a wrong password and the timing does not tell which addresses have accounts.
 */
export async function verifyAgainstDummy(password: string) {
  dummyHash ??= hashPassword('switchback-dummy-password-never-matches')
  await verifyPassword(await dummyHash, password)
  return false
}
