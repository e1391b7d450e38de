// npm run bench (after npm run build): in one run, the bare Nitro yardstick in bench/bare and the built
// app on a freshly seeded demo club; prints one table of figures as ratios to the yardstick, then the
// entry-logging, player, Lighthouse and insights figures. Stops everything it started.
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { gzipSync } from 'node:zlib'
import autocannon from 'autocannon'
import { createClient } from '@libsql/client'
import type { Result as LighthouseResult } from 'lighthouse'
import type { Page } from 'playwright-core'
import { ApiClient } from '../tests/support/client'
import { launchBrowser, newContext, readScheduledBeeps, readStepTimings, watchStepChanges } from '../tests/support/browser'
import { logEverything, seedLoggingAthletes } from '../tests/support/logging-athletes'
import { freePort, root, spawnApp, spawnAppOnFreePort, startStack, waitForServer } from '../tests/support/stack'

const SECONDS = Number(process.env.BENCH_SECONDS ?? 8)
const CONNECTIONS = 10
const DEMO_PASSWORD = 'switchback-demo'
const bare = join(root, 'bench/bare')
// BENCH_PARTS picks parts of the run (comma-separated): reads, entries, player, lighthouse, timer, insights; default all.
// BENCH_LIGHTHOUSE_DIR, when set, keeps each run's full Lighthouse report there as JSON (today-1.json,
// session-<id>-1.json, …) and its trace (today-1.trace.json, for DevTools' performance panel).
// Lighthouse runs per page (BENCH_LIGHTHOUSE_RUNS): the median of their scores is reported, every run's score printed.
const LIGHTHOUSE_RUNS = Number(process.env.BENCH_LIGHTHOUSE_RUNS ?? 5)
// Each of the 50 logging athletes sends this many sets: 6,000 writes, a few seconds of load.
const ENTRY_ROUNDS = 120
const PARTS = new Set((process.env.BENCH_PARTS ?? 'reads,entries,player,lighthouse,timer,insights').split(',').map(part => part.trim()))

function run(command: string, args: string[], options: { cwd?: string, env?: Record<string, string> } = {}) {
  return new Promise<void>((resolveRun, reject) => {
    const child = spawn(command, args, { cwd: options.cwd ?? root, env: { ...process.env, ...options.env }, stdio: ['ignore', 'ignore', 'inherit'] })
    child.on('exit', code => (code === 0 ? resolveRun() : reject(new Error(`${command} ${args.join(' ')} exited with ${code}`))))
  })
}

interface Measured { path: string, who: string, requestsPerSecond: number, p50: number, p99: number, non2xx: number, bytes: number, cpuMsPerRequest?: number }

/** CPU time (user + system) a process has used so far, in ms; Linux only (undefined elsewhere). */
function cpuMsOf(pid: number | undefined) {
  if (!pid || !existsSync(`/proc/${pid}/stat`)) return undefined
  // Fields after the command name (which is in parentheses): utime and stime are the 12th and 13th, in clock ticks.
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ')
  return (Number(fields[11]) + Number(fields[12])) * 10
}

/**
 * Requests per second with CONNECTIONS connections, and the server's CPU time per request: on a machine
 * shared with other work the throughput swings with the load, the CPU a request costs much less.
 */
async function measure(url: string, path: string, who: string, cookie?: string, pid?: number): Promise<Measured> {
  const cpuBefore = cpuMsOf(pid)
  const result = await autocannon({ url: `${url}${path}`, connections: CONNECTIONS, duration: SECONDS, headers: cookie ? { cookie, accept: path.startsWith('/api') ? 'application/json' : 'text/html' } : {} })
  return {
    path,
    who,
    requestsPerSecond: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    non2xx: result.non2xx,
    bytes: result.requests.total ? result.throughput.total / result.requests.total : 0,
    cpuMsPerRequest: cpuBefore === undefined || !result.requests.total ? undefined : (cpuMsOf(pid)! - cpuBefore) / result.requests.total,
  }
}

async function signIn(url: string, email: string) {
  const client = new ApiClient(url)
  const response = await client.post('/api/auth/login', { email, password: DEMO_PASSWORD })
  if (response.status !== 200) throw new Error(`sign-in of ${email} failed: ${response.status} ${response.text}`)
  const cookie = response.headers.getSetCookie().map(value => value.split(';')[0]).join('; ')
  return { client, cookie }
}

/** A fresh Chromium with one phone-sized page carrying the signed-in `cookie`; closed again after `use`. */
async function withPhonePage<T>(url: string, cookie: string, use: (page: Page) => Promise<T>): Promise<T> {
  const browser = await launchBrowser()
  try {
    const context = await newContext(browser, 'phone')
    const [name, value] = cookie.split(';')[0]!.split('=')
    await context.addCookies([{ name: name!, value: value!, url }])
    return await use(await context.newPage())
  }
  finally {
    await browser.close()
  }
}

/** The session player opened cold: every script it loads, and their size gzipped as the build ships them. */
async function playerScripts(url: string, cookie: string, path: string) {
  return withPhonePage(url, cookie, async (page) => {
    const scripts = new Set<string>()
    page.on('request', (request) => {
      if (request.resourceType() === 'script') scripts.add(new URL(request.url()).pathname)
    })
    await page.goto(`${url}${path}`, { waitUntil: 'networkidle' })
    let gzipped = 0
    let raw = 0
    const sizes: { script: string, gzippedKb: number }[] = []
    for (const script of scripts) {
      const file = join(root, '.output/public', script)
      if (!existsSync(file)) continue
      const bytes = readFileSync(file)
      raw += bytes.length
      const size = gzipSync(bytes, { level: 9 }).length
      gzipped += size
      sizes.push({ script, gzippedKb: size / 1024 })
    }
    return { count: scripts.size, gzippedKb: gzipped / 1024, rawKb: raw / 1024, largest: sizes.sort((a, b) => b.gzippedKb - a.gzippedKb).slice(0, 6) }
  })
}

/**
 * The timer in Chromium: a session of six timed steps (2 and 3 s) run in real time; for each step change, how
 * far from the boundary its beep was put on the audio clock (read again from the audio clock when the player
 * reached the boundary), and how long after it the player rendered the change (its own record) and the page's
 * DOM showed it.
 */
async function timerFigures(url: string, databaseUrl: string, cookie: string, email: string) {
  const db = createClient({ url: databaseUrl, timeout: 5000 })
  const found = (await db.execute({ sql: 'SELECT m.user_id AS userId, m.team_id AS teamId FROM memberships m JOIN users u ON u.id = m.user_id WHERE u.email = ? LIMIT 1', args: [email] })).rows[0]!
  const who = { userId: Number(found.userId), teamId: Number(found.teamId) }
  const routine = { id: Number((await db.execute({ sql: 'SELECT id FROM routines WHERE team_id = ? LIMIT 1', args: [who.teamId] })).rows[0]!.id) }
  const durations = [2, 3, 2, 3, 2, 3]
  const snapshot = { title: 'Timer check', category: 'drills', description: '', exercises: [], steps: durations.map((seconds, index) => ({ id: `t${index}`, type: 'block', kind: index % 2 ? 'recovery' : 'work', measure: { by: 'time', seconds } })) }
  const today = new Date().toISOString().slice(0, 10)
  const assignment = await db.execute({ sql: 'INSERT INTO assignments (team_id, athlete_id, routine_id, routine_version, snapshot, date, status) VALUES (?, ?, ?, 1, ?, ?, ?) RETURNING id', args: [who.teamId, who.userId, routine.id, JSON.stringify(snapshot), today, 'planned'] })
  db.close()
  return withPhonePage(url, cookie, async (page) => {
    await page.goto(`${url}/session/${Number(assignment.rows[0]!.id)}`)
    await page.getByRole('checkbox', { name: /I have read the cautions/ }).check()
    await watchStepChanges(page)
    await page.getByRole('button', { name: 'Start session' }).click()
    await page.getByRole('heading', { name: 'Well done — how did it go?' }).waitFor({ timeout: 60_000 })
    const result = await readStepTimings(page)
    if (!result.timings.length) return undefined
    const start = result.timings[0]!.scheduledAt - durations[0]! * 1000
    const rendered = result.timings.map(timing => timing.shownAt - timing.scheduledAt)
    const inDom = result.seen.filter(item => item.index > 0).map(item => item.at - (start + durations.slice(0, item.index).reduce((sum, seconds) => sum + seconds * 1000, 0)))
    const beeps = await readScheduledBeeps(page)
    const beepOffsets = result.timings.flatMap((timing) => {
      const beep = beeps.find(item => item.kind === 'change' && item.boundary === timing.index - 1 && !item.cancelled)
      return beep?.heardAt === undefined ? [] : [beep.heardAt - timing.scheduledAt]
    })
    const stats = (values: number[]) => ({ max: Math.max(...values), mean: values.reduce((sum, item) => sum + item, 0) / values.length })
    return {
      changes: rendered.length,
      rendered: stats(rendered),
      inDom: stats(inDom),
      beeps: beepOffsets.length,
      beepOffset: beepOffsets.length ? { max: Math.max(...beepOffsets.map(Math.abs)), mean: beepOffsets.reduce((sum, item) => sum + Math.abs(item), 0) / beepOffsets.length } : undefined,
      rescheduled: beeps.filter(beep => beep.cancelled).length,
    }
  })
}

async function lighthouseScores(url: string, cookie: string, paths: string[]) {
  let lighthouse: typeof import('lighthouse').default
  let launch: typeof import('chrome-launcher').launch
  let computeMedianRun: typeof import('lighthouse/core/lib/median-run.js').computeMedianRun
  try {
    lighthouse = (await import('lighthouse')).default
    launch = (await import('chrome-launcher')).launch
    computeMedianRun = (await import('lighthouse/core/lib/median-run.js')).computeMedianRun
  }
  catch {
    return paths.map(path => ({ path, note: 'lighthouse is not installed' }))
  }
  const chrome = await launch({ chromePath: process.env.CHROME_PATH ?? '/usr/bin/chromium', chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync'] })
  const score = (lhr: LighthouseResult, id: string) => Math.round((lhr.categories[id]?.score ?? 0) * 100)
  try {
    const scores = []
    for (const path of paths) {
      const runs: LighthouseResult[] = []
      // A run Lighthouse itself could not record (a runtime error such as NO_NAVSTART: "Please run Lighthouse
      // again") measured nothing about the page: it is named in the output and run again, at most three times.
      const failed: string[] = []
      while (runs.length < LIGHTHOUSE_RUNS && failed.length < 3) {
        const result = await lighthouse(`${url}${path}`, { port: chrome.port, output: 'json', logLevel: 'error', extraHeaders: { Cookie: cookie }, onlyCategories: ['performance', 'accessibility', 'best-practices'] })
        const lhr = result!.lhr
        if (process.env.BENCH_LIGHTHOUSE_DIR) {
          mkdirSync(process.env.BENCH_LIGHTHOUSE_DIR, { recursive: true })
          const name = `${path.split('/').filter(Boolean).join('-') || 'home'}-${runs.length + failed.length + 1}`
          writeFileSync(join(process.env.BENCH_LIGHTHOUSE_DIR, `${name}.json`), JSON.stringify(lhr, null, 1))
          writeFileSync(join(process.env.BENCH_LIGHTHOUSE_DIR, `${name}.trace.json`), JSON.stringify(result!.artifacts.Trace))
        }
        if (lhr.runtimeError) failed.push(lhr.runtimeError.code)
        else runs.push(lhr)
      }
      if (!runs.length) {
        scores.push({ path, note: `Lighthouse could not record a run (${failed.join(', ')})` })
        continue
      }
      // The score is the median of the runs' scores: Lighthouse's documentation on variability finds the median
      // score of five runs about twice as stable as one run. The paint and blocking figures are those of the run
      // Lighthouse's own computeMedianRun picks (closest to the median first paint and time to interactive),
      // whose score is printed too: it can differ from the median score.
      const medianRun = computeMedianRun(runs)
      const audit = (id: string) => medianRun.audits[id]?.numericValue ?? Number.NaN
      const performances = runs.map(lhr => score(lhr, 'performance'))
      const middle = [...performances].sort((a, b) => a - b)
      scores.push({
        path,
        performance: middle.length % 2 ? middle[(middle.length - 1) / 2]! : (middle[middle.length / 2 - 1]! + middle[middle.length / 2]!) / 2,
        representative: score(medianRun, 'performance'),
        accessibility: score(medianRun, 'accessibility'),
        bestPractices: score(medianRun, 'best-practices'),
        firstPaintMs: audit('first-contentful-paint'),
        largestPaintMs: audit('largest-contentful-paint'),
        blockingMs: audit('total-blocking-time'),
        transferKb: audit('total-byte-weight') / 1024,
        everyRun: performances,
        failed,
        leastOthers: Math.min(...runs.flatMap(lhr => [score(lhr, 'accessibility'), score(lhr, 'best-practices')])),
      })
    }
    return scores
  }
  finally {
    chrome.kill()
  }
}

/** 50 athletes logging every set of a session at once: acknowledged writes against rows stored. */
async function logSets(databaseUrl: string, url: string, serverPid?: number) {
  console.log('Logging sets: 50 athletes at once…')
  const { athletes } = await seedLoggingAthletes(databaseUrl, url, 50, ENTRY_ROUNDS)
  // CPU spent by the server and by this process (the 50 athletes' requests; it also hosts the object store and
  // the mail catcher, idle here): the two share the machine's cores, so either can be what bounds the rate.
  const serverCpuBefore = cpuMsOf(serverPid)
  const ownCpuBefore = process.cpuUsage()
  const started = performance.now()
  const acknowledged = await logEverything(athletes)
  const elapsed = (performance.now() - started) / 1000
  const serverCpuMs = serverCpuBefore === undefined ? undefined : cpuMsOf(serverPid)! - serverCpuBefore
  const ownCpu = process.cpuUsage(ownCpuBefore)
  const writes = acknowledged.latenciesMs.length
  const db = createClient({ url: databaseUrl, timeout: 5000 })
  const stored = Number((await db.execute(`select count(*) as n from entry_logs where session_id in (${athletes.map(a => a.sessionId).join(',')})`)).rows[0]!.n)
  db.close()
  const sortedLatency = [...acknowledged.latenciesMs].sort((a, b) => a - b)
  return {
    acknowledged: acknowledged.keys.size,
    stored,
    perSecond: acknowledged.keys.size / elapsed,
    p99: sortedLatency[Math.ceil(0.99 * sortedLatency.length) - 1] ?? 0,
    serverCpuMsPerWrite: serverCpuMs === undefined ? undefined : serverCpuMs / writes,
    loadCpuMsPerWrite: (ownCpu.user + ownCpu.system) / 1000 / writes,
    elapsed,
  }
}

async function main() {
  if (!existsSync(join(root, '.output/server/index.mjs'))) throw new Error('Build the app first: npm run build')
  if (!existsSync(join(bare, '.output/server/index.mjs'))) {
    console.log('Building the bare Nitro yardstick (bench/bare)…')
    await run(join(root, 'node_modules/.bin/nitropack'), ['build'], { cwd: bare })
  }
  // The player's timing record (window.switchbackPlayer) is exposed only with the speed switch allowed.
  const stack = await startStack({ OUTBOX_INTERVAL_MS: '600000', NUXT_PUBLIC_PLAYER_SPEED_PARAM: 'true' }, { startApp: false })
  const children: ChildProcess[] = []
  try {
    console.log('Seeding the demo club…')
    await run(join(root, 'node_modules/.bin/tsx'), [join(root, 'seeds/index.ts')], { env: stack.env })
    const app = await spawnApp(stack.env)
    const barePort = await freePort()
    const bareUrl = `http://127.0.0.1:${barePort}`
    const bareChild = spawn(process.execPath, [join(bare, '.output/server/index.mjs')], { env: { PATH: process.env.PATH ?? '', PORT: String(barePort), HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1' }, stdio: 'ignore' })
    children.push(bareChild)
    await waitForServer(bareUrl, bareChild, () => '', '/')

    const coach = await signIn(app.url, 'morwen@larchford.example')
    const athlete = await signIn(app.url, 'tamsin@larchford.example')
    const planned = (await athlete.client.get<{ today: string, assignments: { id: number, date: string }[] }>('/api/me/assignments')).data
    const next = planned.assignments.find(item => item.date >= planned.today)
    const sessionPath = next ? `/session/${next.id}` : '/today'

    const paths: [string, string, string | undefined][] = [
      ['/api/health', 'anyone', undefined],
      ['/api/exercises', 'coach', coach.cookie],
      ['/api/me/assignments', 'athlete', athlete.cookie],
      ['/api/insights/team', 'coach', coach.cookie],
      ['/api/coach/home', 'coach', coach.cookie],
      ['/exercises', 'coach (page)', coach.cookie],
      ['/today', 'athlete (page)', athlete.cookie],
    ]
    console.log(`Measuring ${paths.length + 1} paths, then the signed-in ones again with no answers kept, ${SECONDS} s each with ${CONNECTIONS} connections…`)
    const yardstick = PARTS.has('reads') ? await measure(bareUrl, '/', 'bare Nitro route', undefined, bareChild.pid) : undefined
    const rows: Measured[] = yardstick ? [yardstick] : []
    if (yardstick) for (const [path, who, cookie] of paths) rows.push(await measure(app.url, path, who, cookie, app.child.pid))
    if (yardstick) {
      // The same reads on a second server that keeps no answers (ANSWER_CACHE_MS=0): what each costs when it
      // is computed afresh, as the first read after any write is.
      const { app: computing } = await spawnAppOnFreePort(port => ({ ...stack.env, PORT: String(port), ANSWER_CACHE_MS: '0' }))
      try {
        for (const [path, who, cookie] of paths.filter(([, , cookie]) => cookie)) rows.push(await measure(computing.url, path, `${who}, nothing kept`, cookie, computing.child.pid))
      }
      finally {
        await computing.stop()
      }
    }

    const entries = PARTS.has('entries') ? await logSets(stack.databaseUrl, app.url, app.child.pid) : undefined

    console.log('Opening the session player cold in Chromium…')
    const player = PARTS.has('player') ? await playerScripts(app.url, athlete.cookie, sessionPath) : undefined
    console.log(`Lighthouse (mobile, default throttling, ${LIGHTHOUSE_RUNS} runs a page)…`)
    const lighthouse = PARTS.has('lighthouse') ? await lighthouseScores(app.url, athlete.cookie, ['/today', sessionPath]) : []
    console.log('Timer in Chromium (six timed steps, real time)…')
    const timer = PARTS.has('timer') ? await timerFigures(app.url, stack.databaseUrl, athlete.cookie, 'tamsin@larchford.example') : undefined

    console.log('')
    console.log(`Switchback benchmark · ${new Date().toISOString().slice(0, 10)} · ${SECONDS} s per path, ${CONNECTIONS} connections`)
    console.log('')
    console.log('| path | caller | req/s | vs bare | p50 ms | p99 ms | non-2xx | bytes/resp | server CPU ms/req |')
    console.log('|---|---|---|---|---|---|---|---|---|')
    for (const row of rows) {
      console.log(`| ${row.path} | ${row.who} | ${row.requestsPerSecond.toFixed(0)} | ${(row.requestsPerSecond / yardstick!.requestsPerSecond).toFixed(3)} | ${row.p50} | ${row.p99} | ${row.non2xx} | ${row.bytes.toFixed(0)} | ${row.cpuMsPerRequest?.toFixed(3) ?? '—'} |`)
    }
    console.log('')
    if (entries) console.log(`Entries: ${entries.acknowledged} acknowledged · ${entries.stored} stored · ${entries.perSecond.toFixed(0)} acknowledged writes/s · p99 ${entries.p99.toFixed(1)} ms (50 athletes at once)`)
    if (entries) console.log(`  CPU per write: server ${entries.serverCpuMsPerWrite?.toFixed(3) ?? '—'} ms · the 50 athletes' requests (this process) ${entries.loadCpuMsPerWrite.toFixed(3)} ms · ${entries.elapsed.toFixed(1)} s in all`)
    if (player) {
      console.log(`Session player (${sessionPath}, cold): ${player.count} scripts · ${player.gzippedKb.toFixed(1)} KB gzipped · ${player.rawKb.toFixed(1)} KB raw`)
      console.log(`  largest: ${player.largest.map(item => `${item.script.replace('/_nuxt/', '')} ${item.gzippedKb.toFixed(1)} KB`).join(' · ')}`)
    }
    for (const score of lighthouse) {
      if ('note' in score) {
        console.log(`Lighthouse ${score.path}: ${score.note}`)
        continue
      }
      console.log(`Lighthouse ${score.path}: performance ${score.performance} (median of ${score.everyRun.length} runs: ${score.everyRun.join(', ')}) · accessibility ${score.accessibility} · best practices ${score.bestPractices} (lowest in any run: ${score.leastOthers})`)
      console.log(`  the median run (Lighthouse's computeMedianRun; it scored ${score.representative}): first paint ${(score.firstPaintMs / 1000).toFixed(1)} s · largest paint ${(score.largestPaintMs / 1000).toFixed(1)} s · blocking ${score.blockingMs.toFixed(0)} ms · ${score.transferKb.toFixed(0)} KB${score.failed.length ? ` · not recorded by Lighthouse and run again: ${score.failed.join(', ')}` : ''}`)
    }
    if (timer) {
      if (timer.beepOffset) console.log(`Timer: beeps on the audio clock vs their boundaries (${timer.beeps} of ${timer.changes}): max ${timer.beepOffset.max.toFixed(1)} ms, mean ${timer.beepOffset.mean.toFixed(1)} ms (absolute) · ${timer.rescheduled} moved or cancelled along the way`)
      else console.log(`Timer: no beep was scheduled (the audio context did not run in this browser)`)
      console.log(`Timer: display lag over ${timer.changes} step changes · rendered by the player max ${timer.rendered.max.toFixed(1)} ms, mean ${timer.rendered.mean.toFixed(1)} ms · seen in the DOM max ${timer.inDom.max.toFixed(1)} ms, mean ${timer.inDom.mean.toFixed(1)} ms (one frame ≈ 16.7 ms)`)
    }
    await app.stop()
  }
  finally {
    for (const child of children) child.kill('SIGTERM')
    await stack.stop()
  }
  if (!PARTS.has('insights')) return
  console.log('')
  console.log('Team insights, 100 athletes × a year:')
  await new Promise<void>((resolveRun, reject) => {
    const child = spawn(join(root, 'node_modules/.bin/tsx'), [join(root, 'bench/team-insights.ts')], { cwd: root, stdio: 'inherit' })
    child.on('exit', code => (code === 0 ? resolveRun() : reject(new Error(`team insights bench exited with ${code}`))))
  })
}

main().catch((error) => {
  console.error(error)
  process.exit(1)
})
