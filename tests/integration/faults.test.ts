import { createClient, type Client } from '@libsql/client'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { logEverything, seedLoggingAthletes, type LoggingAthlete } from '../support/logging-athletes'
import { startReplicas, type Replicas } from '../support/replicas'

let replicas: Replicas
let db: Client

beforeAll(async () => {
  replicas = await startReplicas(1, { HEALTH_CHECK_INTERVAL_MS: '300' })
  db = createClient({ url: replicas.stack.databaseUrl, timeout: 5000 })
}, 120_000)

afterAll(async () => {
  db?.close()
  await replicas?.stop()
})

async function storedKeys(athletes: LoggingAthlete[]) {
  const rows = (await db.execute(`select session_id, idempotency_key from entry_logs where session_id in (${athletes.map(a => a.sessionId).join(',')})`)).rows
  return rows.map(row => `${row.session_id}/${row.idempotency_key}`)
}

const keyOf = (athlete: LoggingAthlete, key: string) => `${athlete.sessionId}/${key}`

/** Holds SQLite's write lock from outside the app, as a long migration or a backup tool might. */
async function holdWriteLock() {
  const outsider = createClient({ url: replicas.stack.databaseUrl })
  const transaction = await outsider.transaction('write')
  return async () => {
    await transaction.rollback()
    outsider.close()
  }
}

describe('a hard kill in the middle of a burst of log writes', () => {
  it('keeps every acknowledged write exactly once, and the clients\' resends fill in the rest', async () => {
    const rounds = 60
    const { athletes } = await seedLoggingAthletes(replicas.stack.databaseUrl, replicas.url, 10, rounds)
    let killed: Promise<unknown> | undefined
    // The kill lands a fifth of the way through, whatever the machine's speed.
    const acknowledged = await logEverything(athletes, undefined, (count) => {
      if (count >= 120 && !killed) killed = replicas.apps[0]!.stop('SIGKILL')
    })
    await killed
    const sent = athletes.length * rounds
    expect(acknowledged.keys.size).toBeGreaterThan(0)
    expect(acknowledged.keys.size).toBeLessThan(sent)

    await replicas.restart(0)
    const integrity = (await db.execute('pragma integrity_check')).rows[0]!
    expect(Object.values(integrity)[0]).toBe('ok')
    const afterRestart = await storedKeys(athletes)
    expect(new Set(afterRestart).size).toBe(afterRestart.length)
    for (const athlete of athletes) {
      for (const entry of athlete.entries) {
        if (acknowledged.keys.has(entry.idempotencyKey)) expect(afterRestart).toContain(keyOf(athlete, entry.idempotencyKey))
      }
    }

    // The player's outbox sends again whatever was not acknowledged, with the same keys.
    const resent = await logEverything(athletes, athlete => athlete.entries.filter(entry => !acknowledged.keys.has(entry.idempotencyKey)))
    expect(resent.byStatus.get(201) ?? 0).toBeGreaterThan(0)
    expect(acknowledged.keys.size + resent.keys.size).toBe(sent)
    const final = await storedKeys(athletes)
    expect(final).toHaveLength(sent)
    expect(new Set(final).size).toBe(sent)
  }, 120_000)
})

describe('a database that cannot take writes', () => {
  it('answers 503 with a clear message and no row while locked, keeps reads working, and takes the write once free', async () => {
    const { athletes } = await seedLoggingAthletes(replicas.stack.databaseUrl, replicas.url, 1, 3)
    const athlete = athletes[0]!
    const release = await holdWriteLock()
    let refused: Awaited<ReturnType<typeof athlete.client.post<{ message: string, data?: { requestId?: string } }>>>
    try {
      let writeAnswered = false
      const writing = athlete.client.post<{ message: string, data?: { requestId?: string } }>(`/api/sessions/${athlete!.sessionId}/entries`, athlete!.entries[0])
        .finally(() => (writeAnswered = true))
      // While the write waits for the lock, the same process answers reads: the wait holds up nothing else.
      await new Promise(resolve => setTimeout(resolve, 500))
      const read = await athlete!.client.get<unknown[]>('/api/me/assignments')
      expect(read.status).toBe(200)
      expect(writeAnswered).toBe(false)
      refused = await writing
    }
    finally {
      await release()
    }
    expect(refused.status).toBe(503)
    expect(refused.data.message).toMatch(/busy.*nothing was saved/i)
    expect(refused.headers.get('retry-after')).toBe('5')
    expect(refused.data.data?.requestId).toBe(refused.headers.get('x-request-id'))
    expect(await storedKeys(athletes)).toHaveLength(0)
    expect(replicas.apps[0]!.output()).toContain(`"requestId":"${refused.headers.get('x-request-id')}"`)

    const retried = await athlete!.client.post(`/api/sessions/${athlete!.sessionId}/entries`, athlete!.entries[0])
    expect(retried.status).toBe(201)
    expect(await storedKeys(athletes)).toHaveLength(1)
  }, 120_000)
})

describe('health', () => {
  it('says which part is failing, with liveness and readiness paths', async () => {
    const live = await fetch(`${replicas.url}/api/health/live`)
    expect(live.status).toBe(200)
    const ready = await fetch(`${replicas.url}/api/health/ready`)
    expect(ready.status).toBe(200)
    type Health = { ok: boolean, status: string, parts: Record<string, { ok: boolean, problem?: string }> }
    const healthy = await (await fetch(`${replicas.url}/api/health`)).json() as Health
    expect(healthy).toMatchObject({ ok: true, status: 'ok', parts: { database: { ok: true }, objectStore: { ok: true }, mail: { ok: true } } })

    await replicas.stack.s3.stop()
    await replicas.stack.mail.stop()
    const deadline = Date.now() + 15_000
    let degraded: Health = healthy
    while (Date.now() < deadline) {
      const response = await fetch(`${replicas.url}/api/health`)
      expect(response.status).toBe(200)
      degraded = await response.json() as Health
      if (!degraded.parts.objectStore!.ok && !degraded.parts.mail!.ok) break
      await new Promise(r => setTimeout(r, 200))
    }
    expect(degraded.status).toBe('degraded')
    expect(degraded.parts.database!.ok).toBe(true)
    expect(degraded.parts.objectStore!.problem).toMatch(/clip store cannot be reached/)
    expect(degraded.parts.mail!.problem).toMatch(/mail relay cannot be reached/)
  }, 120_000)
})

describe('a graceful stop', () => {
  it('finishes the request in flight, hands back its outbox claims and exits 0', async () => {
    const { athletes } = await seedLoggingAthletes(replicas.stack.databaseUrl, replicas.url, 1, 2)
    const [athlete] = athletes
    const release = await holdWriteLock()
    // This write waits for the lock (the busy timeout) while the stop signal arrives.
    const inFlight = athlete!.client.post(`/api/sessions/${athlete!.sessionId}/entries`, athlete!.entries[0])
    await new Promise(r => setTimeout(r, 300))
    const exit = replicas.apps[0]!.stop('SIGTERM')
    await new Promise(r => setTimeout(r, 700))
    await release()
    expect((await inFlight).status).toBe(201)
    expect(await exit).toBe(0)
    await expect(fetch(replicas.apps[0]!.url + '/api/health/live')).rejects.toThrow()
    const claimed = (await db.execute('select count(*) as n from email_outbox where status = \'sending\'')).rows[0]!
    expect(Number(claimed.n)).toBe(0)
    expect(replicas.apps[0]!.output()).toContain('"kind":"shutdown"')
    expect(await storedKeys(athletes)).toHaveLength(1)
  }, 120_000)
})
