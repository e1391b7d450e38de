import { randomUUID } from 'node:crypto'
import { sql } from 'drizzle-orm'
import { jobLeases } from '../db/schema'

/** This process's name in the lease table: host and pid for the logs, a random part so restarts differ. */
export const processId = `${process.pid}-${randomUUID().slice(0, 8)}`

/**
 * Takes the lease on `name` for `intervalMs` if nobody holds it: one statement, so with several app
 * processes on one database exactly one of them wins each interval.
 */
export async function takeLease(name: string, intervalMs: number, now = Date.now()): Promise<boolean> {
  const db = await useDb()
  const expiresAt = new Date(now + intervalMs)
  const taken = await db.insert(jobLeases)
    .values({ name, holder: processId, expiresAt, runs: 1, lastRunAt: new Date(now) })
    .onConflictDoUpdate({
      target: jobLeases.name,
      set: { holder: processId, expiresAt, runs: sql`${jobLeases.runs} + 1`, lastRunAt: new Date(now) },
      setWhere: sql`${jobLeases.expiresAt} <= ${now}`,
    })
    .returning({ holder: jobLeases.holder })
  return taken.length === 1
}

/**
 * Runs `job` every `intervalMs` in whichever process holds the lease for that interval.
 * Returns a stop function for the `close` hook, which waits for a run in progress.
 */
export function scheduleLeasedJob(name: string, intervalMs: number, job: () => Promise<unknown>) {
  let running: Promise<unknown> | undefined
  const tick = async () => {
    if (running) return
    const started = Date.now()
    running = (async () => {
      if (!await takeLease(name, intervalMs)) return
      const result = await job()
      logJob(name, { ok: true, durationMs: Date.now() - started, result })
    })().catch((error: unknown) => {
      logJob(name, { ok: false, durationMs: Date.now() - started, error: errorSummary(error) })
    }).finally(() => {
      running = undefined
    })
    await running
  }
  const timer = setInterval(tick, intervalMs)
  timer.unref()
  return async () => {
    clearInterval(timer)
    await running
  }
}
