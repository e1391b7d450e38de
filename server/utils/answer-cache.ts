import type { H3Event } from 'h3'
import { databaseChangeMark } from '../db/prepared-reads'
import type { Caller } from './auth'

/**
 * Answers kept until anything is written to the database (by this process or any other: SQLite's
 * data_version, see databaseChangeMark) or `answerCacheMs` passes (30 s unless ANSWER_CACHE_MS says
 * otherwise; 0 keeps nothing), whichever comes first. The time limit bounds what depends on the clock
 * alone: "today" in each athlete's time zone, an invitation running out. See docs/performance.md.
 */
export class KeptAnswers<Extra = undefined> {
  private readonly kept = new Map<string, { mark: string, body: string, extra: Extra, keptUntil: number }>()
  private keptChars = 0

  constructor(private readonly maxTotalChars: number, private readonly maxOneChars: number) {}

  /** The mark answers are kept under now; undefined when nothing can be kept (switched off, or no local file). */
  static async currentMark() {
    if (useServerConfig().answerCacheMs <= 0) return undefined
    return databaseChangeMark((await useDb()).$client)
  }

  get(key: string, mark: string) {
    const hit = this.kept.get(key)
    if (!hit || hit.mark !== mark || hit.keptUntil <= Date.now()) return undefined
    // Most recently used last, so the oldest is first to go when the store is full.
    this.kept.delete(key)
    this.kept.set(key, hit)
    return hit
  }

  set(key: string, mark: string, body: string, extra: Extra) {
    this.forget(key)
    if (body.length > this.maxOneChars) return
    while (this.keptChars + body.length > this.maxTotalChars) this.forget(this.kept.keys().next().value!)
    this.kept.set(key, { mark, body, extra, keptUntil: Date.now() + useServerConfig().answerCacheMs })
    this.keptChars += body.length
  }

  private forget(key: string) {
    const entry = this.kept.get(key)
    if (!entry) return
    this.kept.delete(key)
    this.keptChars -= entry.body.length
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
