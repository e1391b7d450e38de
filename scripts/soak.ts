// npm run soak [-- --seconds 300 --athletes 50 --replicas 3]: three built app processes on one database
// behind a round-robin, athletes logging sets without pause for the whole time. Prints writes
// acknowledged against rows stored, answers by status, and p99 latency per process (from each
// process's own request log). Run `npm run build` first. Exits 1 if anything acknowledged is missing.
import { existsSync } from 'node:fs'
import { join } from 'node:path'
import { parseArgs } from 'node:util'
import { createClient } from '@libsql/client'
import { seedLoggingAthletes } from '../tests/support/logging-athletes'
import { startReplicas } from '../tests/support/replicas'
import { root } from '../tests/support/stack'

const { values } = parseArgs({ options: {
  seconds: { type: 'string', default: process.env.SOAK_SECONDS ?? '300' },
  athletes: { type: 'string', default: '50' },
  replicas: { type: 'string', default: '3' },
} })
const seconds = Number(values.seconds)
const athleteCount = Number(values.athletes)
const ROUNDS = 40

const percentile = (values: number[], p: number) => {
  if (!values.length) return 0
  const sorted = [...values].sort((a, b) => a - b)
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!
}

if (!existsSync(join(root, '.output/server/index.mjs'))) throw new Error('Build the server first: npm run build')
console.log(`Soak: ${Number(values.replicas)} app processes, ${athleteCount} athletes, ${seconds} s`)
const replicas = await startReplicas(Number(values.replicas))
try {
  const { athletes, nextSession } = await seedLoggingAthletes(replicas.stack.databaseUrl, replicas.url, athleteCount, ROUNDS)
  const acknowledged = new Map<number, Set<string>>()
  const byStatus = new Map<number, number>()
  const latencies: number[] = []
  const deadline = Date.now() + seconds * 1000
  let lastReport = Date.now()
  await Promise.all(athletes.map(async (athlete) => {
    let run = 0
    while (Date.now() < deadline) {
      for (const entry of athlete.entries) {
        if (Date.now() >= deadline) break
        let status = 0
        const started = performance.now()
        // A client's outbox sends again until the server has it, with the same key.
        while (status !== 200 && status !== 201 && Date.now() < deadline + 30_000) {
          try {
            status = (await athlete.client.post(`/api/sessions/${athlete.sessionId}/entries`, entry)).status
          }
          catch {
            status = 0
          }
          byStatus.set(status, (byStatus.get(status) ?? 0) + 1)
        }
        latencies.push(performance.now() - started)
        if (status === 200 || status === 201) {
          const keys = acknowledged.get(athlete.sessionId) ?? new Set()
          keys.add(entry.idempotencyKey)
          acknowledged.set(athlete.sessionId, keys)
        }
        if (Date.now() - lastReport > 15_000) {
          lastReport = Date.now()
          const done = [...acknowledged.values()].reduce((sum, keys) => sum + keys.size, 0)
          console.log(`  … ${Math.round((deadline - Date.now()) / 1000)} s left, ${done} writes acknowledged`)
        }
      }
      if (Date.now() < deadline) await nextSession(athlete, ++run)
    }
  }))

  const db = createClient({ url: replicas.stack.databaseUrl, timeout: 5000 })
  let stored = 0
  let missing = 0
  for (const [sessionId, keys] of acknowledged) {
    const rows = (await db.execute({ sql: 'select idempotency_key from entry_logs where session_id = ?', args: [sessionId] })).rows.map(row => String(row.idempotency_key))
    stored += rows.length
    const present = new Set(rows)
    for (const key of keys) if (!present.has(key)) missing += 1
  }
  const integrity = String(Object.values((await db.execute('pragma integrity_check')).rows[0]!)[0])
  db.close()
  const acknowledgedCount = [...acknowledged.values()].reduce((sum, keys) => sum + keys.size, 0)

  console.log('')
  console.log(`writes acknowledged ${acknowledgedCount} · stored ${stored} · lost ${missing} · integrity ${integrity}`)
  console.log(`client answers by status: ${[...byStatus].sort(([a], [b]) => a - b).map(([status, count]) => `${status === 0 ? 'no answer' : status} × ${count}`).join(', ')}`)
  console.log(`client p50 ${percentile(latencies, 50).toFixed(1)} ms · p99 ${percentile(latencies, 99).toFixed(1)} ms · ${(acknowledgedCount / seconds).toFixed(0)} writes/s`)
  console.log('')
  console.log('| process | entry writes | errors by status | p99 ms |')
  console.log('|---|---|---|---|')
  for (const [index, app] of replicas.apps.entries()) {
    const lines = app.output().split('\n').filter(line => line.includes('"route":"/api/sessions/:id/entries"')).map(line => JSON.parse(line) as { status: number, durationMs: number })
    const errors = new Map<number, number>()
    for (const line of lines) if (line.status >= 400) errors.set(line.status, (errors.get(line.status) ?? 0) + 1)
    console.log(`| ${index + 1} | ${lines.length} | ${[...errors].map(([status, count]) => `${status} × ${count}`).join(', ') || 'none'} | ${percentile(lines.map(line => line.durationMs), 99).toFixed(1)} |`)
  }
  process.exitCode = missing === 0 && stored === acknowledgedCount && integrity === 'ok' ? 0 : 1
}
finally {
  await replicas.stop()
}
