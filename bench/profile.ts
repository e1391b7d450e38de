// npm run bench:profile (after npm run build): the built app under `node --cpu-prof` on a freshly seeded
// demo club, loaded with autocannon on one path at a time; prints each profile's heaviest functions (self
// time) and leaves the .cpuprofile files for Chrome's DevTools. PROFILE_PATHS picks the paths (comma-separated,
// default: the library, the athlete's assignments, team insights, /today; `entries` for 50 athletes logging
// sets at once); BENCH_SECONDS the seconds per path; ANSWER_CACHE_MS=0 keeps no answers or pages.
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs'
import { spawn } from 'node:child_process'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import autocannon from 'autocannon'
import { ApiClient } from '../tests/support/client'
import { logEverything, seedLoggingAthletes } from '../tests/support/logging-athletes'
import { freePort, root, startStack, waitForServer } from '../tests/support/stack'

const SECONDS = Number(process.env.BENCH_SECONDS ?? 6)
const PATHS = (process.env.PROFILE_PATHS ?? '/api/exercises,/api/me/assignments,/api/insights/team,/today').split(',')
const athletePaths = new Set(['/today', '/api/me/assignments', '/logbook', '/progress'])

interface ProfileNode { id: number, callFrame: { functionName: string, url: string, lineNumber: number }, children?: number[] }
interface Profile { nodes: ProfileNode[], samples: number[], timeDeltas: number[] }

/** Self time per function (name + file:line), heaviest first, as shares of all samples. */
function heaviest(profile: Profile, top = 25) {
  const byId = new Map(profile.nodes.map(node => [node.id, node]))
  const self = new Map<string, number>()
  profile.samples.forEach((id, index) => {
    const frame = byId.get(id)!.callFrame
    const file = frame.url.replace(/^file:\/\//, '').replace(root, '').replace(/.*node_modules\//, '~/')
    const name = `${frame.functionName || '(anonymous)'} ${file}:${frame.lineNumber + 1}`
    self.set(name, (self.get(name) ?? 0) + (profile.timeDeltas[index] ?? 0))
  })
  const total = [...self.values()].reduce((sum, value) => sum + value, 0)
  return [...self.entries()].sort((a, b) => b[1] - a[1]).slice(0, top).map(([name, time]) => `${(100 * time / total).toFixed(1).padStart(5)}%  ${name}`)
}

/** The built server under `--cpu-prof`; the profile is written when it exits after SIGTERM. */
async function profiledApp(env: Record<string, string>, dir: string, name: string) {
  const url = `http://127.0.0.1:${env.PORT}`
  let output = ''
  const child = spawn(process.execPath, ['--cpu-prof', `--cpu-prof-dir=${dir}`, `--cpu-prof-name=${name}`, join(root, '.output/server/index.mjs')], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] })
  child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()))
  child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()))
  const exited = new Promise<void>(resolveExit => child.once('exit', () => resolveExit()))
  await waitForServer(url, child, () => output)
  return {
    url,
    stop: async () => {
      child.kill('SIGTERM')
      await exited
    },
  }
}

async function main() {
  // ANSWER_CACHE_MS=0 profiles every answer computed, as the first read after a write is.
  const keep: Record<string, string> = process.env.ANSWER_CACHE_MS === undefined ? {} : { ANSWER_CACHE_MS: process.env.ANSWER_CACHE_MS }
  const stack = await startStack({ OUTBOX_INTERVAL_MS: '600000', ...keep }, { startApp: false })
  try {
    await new Promise<void>((resolveRun, reject) => {
      const child = spawn(join(root, 'node_modules/.bin/tsx'), [join(root, 'seeds/index.ts')], { cwd: root, env: { ...process.env, ...stack.env }, stdio: ['ignore', 'ignore', 'inherit'] })
      child.on('exit', code => (code === 0 ? resolveRun() : reject(new Error(`seeding exited with ${code}`))))
    })
    const out = process.env.PROFILE_DIR ?? mkdtempSync(join(tmpdir(), 'switchback-profile-'))
    for (const path of PATHS) {
      const port = await freePort()
      const app = await profiledApp({ ...stack.env, PORT: String(port) }, out, `${path.replace(/\W+/g, '_')}.cpuprofile`)
      if (path === 'entries') {
        // 50 athletes logging 60 sets each at once, as in npm run bench.
        const { athletes } = await seedLoggingAthletes(stack.databaseUrl, app.url, 50, 60)
        const started = performance.now()
        const acknowledged = await logEverything(athletes)
        await app.stop()
        console.log(`\nentries: ${(acknowledged.keys.size / ((performance.now() - started) / 1000)).toFixed(0)} acknowledged writes/s`)
        const file = readdirSync(out).find(name => name.startsWith('entries'))
        if (file) for (const line of heaviest(JSON.parse(readFileSync(join(out, file), 'utf8')) as Profile)) console.log(`  ${line}`)
        continue
      }
      const email = athletePaths.has(path) ? 'tamsin@larchford.example' : 'morwen@larchford.example'
      const response = await new ApiClient(app.url).post('/api/auth/login', { email, password: 'switchback-demo' })
      const cookie = response.headers.getSetCookie().map(value => value.split(';')[0]).join('; ')
      const result = await autocannon({ url: `${app.url}${path}`, connections: 10, duration: SECONDS, headers: { cookie, accept: path.startsWith('/api') ? 'application/json' : 'text/html' } })
      await app.stop()
      console.log(`\n${path}: ${result.requests.average.toFixed(0)} req/s, p99 ${result.latency.p99} ms, non-2xx ${result.non2xx}`)
      const file = readdirSync(out).find(name => name.startsWith(path.replace(/\W+/g, '_')))
      if (!file) {
        console.log('  (no profile written)')
        continue
      }
      for (const line of heaviest(JSON.parse(readFileSync(join(out, file), 'utf8')) as Profile)) console.log(`  ${line}`)
    }
    console.log(`\nProfiles in ${out}`)
  }
  finally {
    await stack.stop()
  }
}

main().catch((error) => {
  console.error(error)
  process.exit(1)
})
