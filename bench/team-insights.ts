// Team insights under a year of history: 100 athletes with a session every day, in a temporary database.
// Starts the built server (run `npx nuxt build` first) and prints the team route's median and p95 latency.
import { spawn } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { createClient } from '@libsql/client'
import { sql } from 'drizzle-orm'
import { migrateDatabase, openDatabase } from '../server/db/client'
import { assignments, memberships, painFlags, routines, sessionLogs, teams, users } from '../server/db/schema'
import { addDays, todayIn } from '../shared/utils/dates'
import { hashPassword } from '../seeds/context'
import { freePort } from '../tests/support/stack'
import { ApiClient } from '../tests/support/client'

const ATHLETES = 100
const DAYS = 365
const REQUESTS = 50
const PASSWORD = 'benchmark-password'
const root = resolve(import.meta.dirname, '..')

async function main() {
  if (!existsSync(join(root, '.output/server/index.mjs'))) throw new Error('Build the server first: npx nuxt build')
  const dir = mkdtempSync(join(tmpdir(), 'switchback-bench-'))
  const databaseUrl = `file:${join(dir, 'bench.db')}`
  const db = await openDatabase(databaseUrl)
  await migrateDatabase(db)
  const started = Date.now()

  const passwordHash = await hashPassword(PASSWORD)
  const [team] = await db.insert(teams).values({ name: 'Benchmark Harriers' }).returning()
  const [coach] = await db.insert(users).values({ name: 'Bench Coach', email: 'coach@bench.example', passwordHash }).returning()
  await db.insert(memberships).values({ teamId: team!.id, userId: coach!.id, role: 'head_coach' })
  const [routine] = await db.insert(routines).values({ teamId: team!.id, title: 'Daily circuit', category: 'strength', steps: [] }).returning()
  const snapshot = { title: 'Daily circuit', category: 'strength', description: '', steps: [], exercises: [] }
  const athleteRows = await db.insert(users).values(Array.from({ length: ATHLETES }, (_, index) => ({
    name: `Athlete ${String(index + 1).padStart(3, '0')}`, email: `athlete${index + 1}@bench.example`, passwordHash,
  }))).returning({ id: users.id })
  await db.insert(memberships).values(athleteRows.map(row => ({ teamId: team!.id, userId: row.id, role: 'athlete' as const })))

  const today = todayIn('UTC')
  let flags = 0
  for (const [index, athlete] of athleteRows.entries()) {
    await db.transaction(async (tx) => {
      const planned = await tx.insert(assignments).values(Array.from({ length: DAYS }, (_, daysAgo) => ({
        teamId: team!.id, athleteId: athlete.id, routineId: routine!.id, routineVersion: 1, snapshot,
        date: addDays(today, -daysAgo), status: (daysAgo + index) % 5 === 0 ? 'skipped' as const : 'done' as const,
      }))).returning({ id: assignments.id, date: assignments.date, status: assignments.status })
      const done = planned.filter(row => row.status === 'done')
      for (let start = 0; start < done.length; start += 200) {
        const logs = await tx.insert(sessionLogs).values(done.slice(start, start + 200).map((row, offset) => {
          const startedAt = new Date(`${row.date}T07:00:00Z`)
          const rpe = 3 + ((start + offset + index) % 6)
          return {
            teamId: team!.id, assignmentId: row.id, athleteId: athlete.id, clientId: `bench-${row.id}`,
            startedAt, finishedAt: new Date(startedAt.getTime() + 2700_000), day: row.date,
            durationS: 2700, sessionRpe: rpe, load: rpe * 45, pain: (offset % 40 === 0) ? 6 : null, painArea: (offset % 40 === 0) ? 'knee' : null,
          }
        })).returning({ id: sessionLogs.id, pain: sessionLogs.pain })
        const painful = logs.filter(log => log.pain !== null).slice(0, 1)
        if (painful.length) {
          await tx.insert(painFlags).values(painful.map(log => ({ teamId: team!.id, athleteId: athlete.id, sessionId: log.id, pain: 6, area: 'knee', reason: 'high_pain' as const })))
          flags += painful.length
        }
      }
    })
  }
  const [{ count }] = await db.select({ count: sql<number>`count(*)` }).from(sessionLogs) as [{ count: number }]
  await db.$client.execute('ANALYZE')
  db.$client.close()
  console.log(`Created ${ATHLETES} athletes, ${ATHLETES * DAYS} assignments, ${count} session logs and ${flags} pain flags in ${((Date.now() - started) / 1000).toFixed(1)} s`)

  const port = await freePort()
  const url = `http://127.0.0.1:${port}`
  const child = spawn(process.execPath, [join(root, '.output/server/index.mjs')], {
    cwd: root,
    env: { PATH: process.env.PATH ?? '', NODE_ENV: 'production', PORT: String(port), HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1', DATABASE_URL: databaseUrl, NUXT_SESSION_PASSWORD: 'benchmark-session-password-long-enough-1234', APP_URL: url, SMTP_URL: 'smtp://127.0.0.1:9', OUTBOX_INTERVAL_MS: '600000' },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
  try {
    const deadline = Date.now() + 30_000
    while (true) {
      try {
        if ((await fetch(`${url}/api/health`)).ok) break
      }
      catch {
        // not listening yet
      }
      if (Date.now() > deadline) throw new Error('The server did not start')
      await new Promise(r => setTimeout(r, 100))
    }
    const client = new ApiClient(url)
    const login = await client.post('/api/auth/login', { email: 'coach@bench.example', password: PASSWORD })
    if (login.status !== 200) throw new Error(`Sign-in failed: ${login.status} ${login.text}`)

    const path = '/api/insights/team?pageSize=100&sort=-acwrEwma'
    for (let warm = 0; warm < 5; warm++) await client.get(path)
    // The server keeps an answer until the database changes (server/utils/answer-cache.ts). The figure that
    // counts is the one computed afresh, as a coach sees it after an athlete has logged: a change written from
    // outside the server (untimed; a write that changes nothing does not count) comes before each of those
    // requests. Repeats with nothing written between are printed apart.
    const writer = createClient({ url: databaseUrl, timeout: 5000 })
    const measure = async (afterWrite: boolean) => {
      const timings: number[] = []
      let rows = 0
      for (let request = 0; request < REQUESTS; request++) {
        if (afterWrite) await writer.execute({ sql: 'update teams set name = ? where id = ?', args: [`Benchmark Harriers ${request}`, team!.id] })
        const begin = performance.now()
        const response = await client.get<{ rows: unknown[] }>(path)
        timings.push(performance.now() - begin)
        if (response.status !== 200) throw new Error(`Team route answered ${response.status}: ${response.text}`)
        rows = response.data.rows.length
      }
      timings.sort((a, b) => a - b)
      const at = (fraction: number) => timings[Math.min(timings.length - 1, Math.ceil(fraction * timings.length) - 1)]!
      return { rows, text: `median ${at(0.5).toFixed(1)} ms · p95 ${at(0.95).toFixed(1)} ms · max ${timings.at(-1)!.toFixed(1)} ms` }
    }
    const fresh = await measure(true)
    const kept = await measure(false)
    writer.close()
    console.log(`GET ${path} → ${fresh.rows} rows, ${REQUESTS} requests each`)
    console.log(`  computed afresh (a write before each): ${fresh.text} (target: median at most 15 ms)`)
    console.log(`  repeated, nothing written between: ${kept.text}`)
  }
  finally {
    child.kill('SIGTERM')
    if (process.env.BENCH_KEEP) console.log(`Kept ${databaseUrl}`)
    else rmSync(dir, { recursive: true, force: true })
  }
}

main().catch((error) => {
  console.error(error)
  process.exit(1)
})
