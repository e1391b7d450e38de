import type { H3Event } from 'h3'
import { databaseChangeMark } from '../db/prepared-reads'
import type { Caller } from './auth'

/**
 * The JSON answers of the busiest read routes, kept per caller and address until anything is written to the
 * database (by this process or any other: SQLite's data_version, see databaseChangeMark) or `answerCacheMs`
 * passes (30 s unless ANSWER_CACHE_MS says otherwise; 0 keeps nothing), whichever comes first. The time limit bounds what depends on the clock alone: "today" in each
 * athlete's time zone, an invitation running out. A kept answer is sent as the same bytes, so a repeated
 * read costs the caller check and one PRAGMA instead of its queries and serialising. See docs/performance.md.
 */
const MAX_ANSWER_CHARS = 512 * 1024
const MAX_TOTAL_CHARS = 32 * 1024 * 1024

interface Kept { mark: string, body: string, keptUntil: number }

const kept = new Map<string, Kept>()
let keptChars = 0

function forget(key: string) {
  const entry = kept.get(key)
  if (!entry) return
  kept.delete(key)
  keptChars -= entry.body.length
}

/**
 * Answers `compute()`'s result, or the one kept for the same caller (person, team, role, time zone) and
 * address if nothing has been written since. Only successful answers are kept.
 */
export async function keptAnswer<T>(event: H3Event, caller: Caller, compute: () => Promise<T>): Promise<T> {
  const keepFor = useServerConfig().answerCacheMs
  const mark = keepFor > 0 ? databaseChangeMark((await useDb()).$client) : undefined
  if (!mark) return compute()
  const key = `${caller.teamId}\n${caller.userId}\n${caller.role}\n${caller.timezone}\n${event.path}`
  const hit = kept.get(key)
  if (hit && hit.mark === mark && hit.keptUntil > Date.now()) {
    // Most recently used last, so the oldest is first to go when the cache is full.
    kept.delete(key)
    kept.set(key, hit)
    return sendJson(event, hit.body)
  }
  const body = JSON.stringify(await compute())
  forget(key)
  if (body.length <= MAX_ANSWER_CHARS) {
    while (keptChars + body.length > MAX_TOTAL_CHARS) forget(kept.keys().next().value!)
    kept.set(key, { mark, body, keptUntil: Date.now() + keepFor })
    keptChars += body.length
  }
  return sendJson(event, body)
}

/** The serialised answer as it is; typed as the answer itself so the route's inferred type stays the same. */
function sendJson<T>(event: H3Event, body: string): T {
  setResponseHeader(event, 'content-type', 'application/json')
  return body as T
}
