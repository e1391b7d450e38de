import type { H3Event } from 'h3'
import { databaseChangeMark } from '../db/prepared-reads'
import type { Caller } from './auth'
import { ExpiringCache } from './expiring-cache'

/**
 * Answers kept until anything is written to the database (by this process or any other: SQLite's
 * data_version, see databaseChangeMark) or `answerCacheMs` passes (30 s unless ANSWER_CACHE_MS says
 * otherwise; 0 keeps nothing), whichever comes first. The time limit bounds what depends on the clock
 * alone: "today" in each athlete's time zone, an invitation running out. See docs/performance.md.
 */
export class KeptAnswers<Extra = undefined> {
  private readonly kept: ExpiringCache<{ mark: string, body: string, extra: Extra }>

  constructor(maxTotalChars: number, private readonly maxOneChars: number) {
    this.kept = new ExpiringCache(maxTotalChars, answer => answer.body.length)
  }

  /** The mark answers are kept under now; undefined when nothing can be kept (switched off, or no local file). */
  static async currentMark() {
    if (useServerConfig().answerCacheMs <= 0) return undefined
    return databaseChangeMark((await useDb()).$client)
  }

  get(key: string, mark: string) {
    const hit = this.kept.get(key)
    return hit?.mark === mark ? hit : undefined
  }

  set(key: string, mark: string, body: string, extra: Extra) {
    if (body.length > this.maxOneChars) this.kept.delete(key)
    else this.kept.set(key, { mark, body, extra }, Date.now() + useServerConfig().answerCacheMs)
  }
}

const answers = new KeptAnswers(32 * 1024 * 1024, 512 * 1024)

/**
 * The JSON answer of a busy read route: `compute()`'s result, or the same bytes kept for the same caller
 * (person, team, role, time zone) and address if nothing has been written since. A kept answer costs the
 * caller check and one PRAGMA instead of its queries and serialising. Only successful answers are kept.
 */
export async function keptAnswer<T>(event: H3Event, caller: Caller, compute: () => Promise<T>): Promise<T> {
  const mark = await KeptAnswers.currentMark()
  if (!mark) return compute()
  const key = `${caller.teamId}\n${caller.userId}\n${caller.role}\n${caller.timezone}\n${event.path}`
  const hit = answers.get(key, mark)
  if (hit) return sendJson(event, hit.body)
  const body = JSON.stringify(await compute())
  answers.set(key, mark, body, undefined)
  return sendJson(event, body)
}

/** The serialised answer as it is; typed as the answer itself so the route's inferred type stays the same. */
function sendJson<T>(event: H3Event, body: string): T {
  setResponseHeader(event, 'content-type', 'application/json')
  return body as T
}
