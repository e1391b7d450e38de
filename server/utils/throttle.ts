import { and, count, eq, gte, lt } from 'drizzle-orm'
import type { H3Event } from 'h3'
import { loginFailures } from '../db/schema'

const WINDOW_MS = 15 * 60 * 1000
const MAX_PER_EMAIL = 5
const MAX_PER_ADDRESS = 30

export function clientAddress(event: H3Event) {
  return getRequestIP(event, { xForwardedFor: useServerConfig().trustProxy }) ?? 'unknown'
}

/** 429 once an e-mail or an address has failed too often in the last 15 minutes. */
export async function assertLoginAllowed(email: string, ip: string) {
  const db = await useDb()
  const since = new Date(Date.now() - WINDOW_MS)
  const [[byEmail], [byAddress]] = await Promise.all([
    db.select({ n: count() }).from(loginFailures).where(and(eq(loginFailures.email, email), gte(loginFailures.at, since))),
    db.select({ n: count() }).from(loginFailures).where(and(eq(loginFailures.ip, ip), gte(loginFailures.at, since))),
  ])
  if ((byEmail?.n ?? 0) >= MAX_PER_EMAIL || (byAddress?.n ?? 0) >= MAX_PER_ADDRESS) {
    refuse(429, 'Too many failed sign-ins. Wait 15 minutes or reset your password.')
  }
}

export async function recordLoginFailure(email: string, ip: string) {
  const db = await useDb()
  await db.insert(loginFailures).values({ email, ip, at: new Date() })
  await db.delete(loginFailures).where(lt(loginFailures.at, new Date(Date.now() - WINDOW_MS)))
}

export async function clearLoginFailures(email: string) {
  const db = await useDb()
  await db.delete(loginFailures).where(eq(loginFailures.email, email))
}
