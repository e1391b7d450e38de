import { createClient, type Client } from '@libsql/client'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { ApiClient } from '../support/client'
import { logEverything, seedLoggingAthletes } from '../support/logging-athletes'
import { startReplicas, type Replicas } from '../support/replicas'
import { registerCoach } from '../support/team'

const SWEEP_MS = 400
let replicas: Replicas
let db: Client
let startedAt: number

beforeAll(async () => {
  startedAt = Date.now()
  replicas = await startReplicas(3, { MEDIA_SWEEP_INTERVAL_MS: String(SWEEP_MS), OUTBOX_INTERVAL_MS: '100' })
  db = createClient({ url: replicas.stack.databaseUrl, timeout: 5000 })
}, 120_000)

afterAll(async () => {
  db?.close()
  await replicas?.stop()
})

describe('three app processes on one database', () => {
  it('accepts a session cookie made by one process on the others', async () => {
    const { coach } = await registerCoach(replicas.stack)
    const onFirst = coach.on(replicas.apps[0]!.url)
    expect((await onFirst.get<{ user: { id: number } }>('/api/me')).status).toBe(200)
    for (const app of replicas.apps.slice(1)) {
      const elsewhere = onFirst.on(app.url)
      const me = await elsewhere.get<{ user: { name: string } }>('/api/me')
      expect(me.status).toBe(200)
      expect(me.data.user.name).toBe('Morwen Tay')
    }
    // A stranger's cookie-less request is refused everywhere.
    for (const app of replicas.apps) expect((await new ApiClient(app.url).get('/api/exercises')).status).toBe(401)
  }, 120_000)

  it('sends each queued e-mail exactly once, whichever process claims it', async () => {
    const recipients = Array.from({ length: 60 }, (_, index) => `outbox${index}.${Date.now().toString(36)}@example.test`)
    await db.batch(recipients.map(to => ({
      sql: 'insert into email_outbox ("to", template, payload) values (?, ?, ?)',
      args: [to, 'password_reset', JSON.stringify({ name: 'Cai', url: 'http://localhost/reset/x' })],
    })), 'write')
    const deadline = Date.now() + 30_000
    let sent = 0
    while (Date.now() < deadline) {
      const row = (await db.execute({ sql: `select count(*) as n from email_outbox where status = 'sent' and "to" like 'outbox%'`, args: [] })).rows[0]!
      sent = Number(row.n)
      if (sent === recipients.length) break
      await new Promise(r => setTimeout(r, 200))
    }
    expect(sent).toBe(recipients.length)
    // Give a second sender every chance to send a duplicate before counting.
    await new Promise(r => setTimeout(r, 1000))
    for (const to of recipients) expect(replicas.stack.mail.to(to)).toHaveLength(1)
  }, 120_000)

  it('runs the clip sweep once per interval across all processes (a lease in the database)', async () => {
    await new Promise(r => setTimeout(r, SWEEP_MS * 8))
    const elapsed = Date.now() - startedAt
    const [lease] = (await db.execute('select holder, runs from job_leases where name = \'media-sweep\'')).rows
    expect(lease).toBeDefined()
    const runs = Number(lease!.runs)
    // Without the lease, three processes would run it about three times per interval.
    expect(runs).toBeGreaterThanOrEqual(2)
    expect(runs).toBeLessThanOrEqual(Math.ceil(elapsed / SWEEP_MS) + 1)
    const logged = replicas.apps.map(app => app.output().split('\n').filter(line => line.includes('"job":"media-sweep"') && line.includes('"ok":true')).length)
    expect(logged.reduce((sum, count) => sum + count, 0)).toBeLessThanOrEqual(runs)
  }, 120_000)

  it('loses nothing when 50 athletes log through all three at once', async () => {
    const { athletes } = await seedLoggingAthletes(replicas.stack.databaseUrl, replicas.url, 50, 20)
    const acknowledged = await logEverything(athletes)
    expect(acknowledged.keys.size).toBe(50 * 20)
    const sessionIds = athletes.map(athlete => athlete.sessionId)
    const stored = (await db.execute(`select count(*) as n, count(distinct session_id || ':' || idempotency_key) as distinctKeys from entry_logs where session_id in (${sessionIds.join(',')})`)).rows[0]!
    expect(Number(stored.n)).toBe(50 * 20)
    expect(Number(stored.distinctKeys)).toBe(50 * 20)
    // Every process took a share of the writes.
    for (const app of replicas.apps) expect(app.output()).toContain('"route":"/api/sessions/:id/entries"')
  }, 120_000)
})
