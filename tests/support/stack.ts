import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { createServer } from 'node:net'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import S3rver from 's3rver'
import { MailCatcher } from './mail-catcher'

export const root = resolve(import.meta.dirname, '../..')
export const S3_BUCKET = 'switchback-test'

export async function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const server = createServer()
    server.unref()
    server.on('error', reject)
    server.listen(0, '127.0.0.1', () => {
      const address = server.address()
      server.close(() => resolvePort(typeof address === 'object' && address ? address.port : 0))
    })
  })
}

export const corsXml = `<CORSConfiguration><CORSRule><AllowedOrigin>*</AllowedOrigin><AllowedMethod>GET</AllowedMethod><AllowedMethod>PUT</AllowedMethod><AllowedMethod>HEAD</AllowedMethod><AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds></CORSRule></CORSConfiguration>`

export interface Stack {
  url: string
  dir: string
  databaseUrl: string
  mail: MailCatcher
  s3: { endpoint: string, bucket: string, stop: () => Promise<unknown>, start: () => Promise<void> }
  env: Record<string, string>
  /** What the app server has printed since it (re)started. */
  log: () => string
  /** Stops and starts the app server again on the same port and database. */
  restartApp: () => Promise<void>
  stop: () => Promise<void>
}

export async function waitForServer(url: string, child: ChildProcess, log: () => string, path = '/api/health') {
  const deadline = Date.now() + 60_000
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`App server exited early:\n${log()}`)
    try {
      const response = await fetch(`${url}${path}`)
      if (response.ok) return
    }
    catch {
      // not listening yet
    }
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error(`App server did not start:\n${log()}`)
}

export interface AppProcess {
  url: string
  child: ChildProcess
  /** Everything the process printed so far. */
  output: () => string
  /** SIGTERM (a graceful stop), then SIGKILL after 5 s; resolves with the exit code. */
  stop: (signal?: NodeJS.Signals) => Promise<number | null>
}

/** Starts one built app process with `env`, on `env.PORT`, and waits until it answers. */
export async function spawnApp(env: Record<string, string>): Promise<AppProcess> {
  const url = `http://127.0.0.1:${env.PORT}`
  let output = ''
  const child = spawn(process.execPath, [join(root, '.output/server/index.mjs')], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] })
  const collect = (chunk: Buffer) => {
    output += chunk.toString()
  }
  child.stdout?.on('data', collect)
  child.stderr?.on('data', collect)
  const exited = new Promise<number | null>(resolveExit => child.once('exit', code => resolveExit(code)))
  await waitForServer(url, child, () => output)
  return {
    url,
    child,
    output: () => output,
    stop: async (signal = 'SIGTERM') => {
      if (child.exitCode !== null || child.signalCode !== null) return child.exitCode
      child.kill(signal)
      const force = setTimeout(() => child.kill('SIGKILL'), 5000)
      force.unref()
      const code = await exited
      clearTimeout(force)
      return code
    },
  }
}

/**
 * Starts one built app on `port` (a free one when not given). A port chosen as free is only free until
 * something else takes it (another test file's outgoing connection, say): then the app starts on another.
 */
export async function spawnAppOnFreePort(envFor: (port: number) => Record<string, string>, port?: number): Promise<{ app: AppProcess, port: number }> {
  let chosen = port ?? await freePort()
  for (let attempt = 1; ; attempt += 1) {
    try {
      return { app: await spawnApp(envFor(chosen)), port: chosen }
    }
    catch (error) {
      if (attempt >= 5 || !String(error).includes('EADDRINUSE')) throw error
      chosen = await freePort()
    }
  }
}

/**
 * The real built server (`.output`, from `npm run build`) against a temporary SQLite file,
 * a real S3-compatible store (s3rver) and an in-process SMTP catcher, each on a free port.
 */
export async function startStack(extraEnv: Record<string, string> = {}, options: { startApp?: boolean } = {}): Promise<Stack> {
  const dir = mkdtempSync(join(tmpdir(), 'switchback-test-'))
  const [appPort, smtpPort, s3Port] = [await freePort(), await freePort(), await freePort()]
  const mail = new MailCatcher(smtpPort)
  await mail.start()

  writeFileSync(join(dir, 'cors.xml'), corsXml)
  const openStore = async () => {
    const store = new S3rver({
      port: s3Port,
      address: '127.0.0.1',
      silent: true,
      directory: join(dir, 's3'),
      configureBuckets: [{ name: S3_BUCKET, configs: [corsXml] }],
    })
    await store.run()
    return store
  }
  let s3rver = await openStore()
  const s3 = {
    endpoint: `http://127.0.0.1:${s3Port}`,
    bucket: S3_BUCKET,
    stop: () => s3rver.close().catch(() => undefined),
    /** Starts the store again on the same port and folder, after `stop` (an outage that ends). */
    start: async () => {
      s3rver = await openStore()
    },
  }

  let url = `http://127.0.0.1:${appPort}`
  const databaseUrl = `file:${join(dir, 'test.db')}`
  const env: Record<string, string> = {
    PATH: process.env.PATH ?? '',
    HOME: process.env.HOME ?? '',
    NODE_ENV: 'production',
    PORT: String(appPort),
    HOST: '127.0.0.1',
    NITRO_HOST: '127.0.0.1',
    DATABASE_URL: databaseUrl,
    NUXT_SESSION_PASSWORD: 'test-session-password-that-is-long-enough-1234',
    APP_URL: url,
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    MAIL_FROM: 'Switchback Test <test@switchback.local>',
    S3_ENDPOINT: s3.endpoint,
    S3_REGION: 'us-east-1',
    S3_BUCKET,
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    OUTBOX_INTERVAL_MS: '200',
    OUTBOX_BACKOFF_MS: '200',
    ...extraEnv,
  }

  let app: AppProcess | undefined
  async function startApp() {
    app = await spawnApp(env)
  }
  async function stopApp() {
    await app?.stop()
  }
  async function firstStart() {
    const started = await spawnAppOnFreePort(port => ({ ...env, PORT: String(port), APP_URL: `http://127.0.0.1:${port}`, ...extraEnv }), appPort)
    app = started.app
    url = `http://127.0.0.1:${started.port}`
    Object.assign(env, { PORT: String(started.port), APP_URL: url, ...extraEnv })
  }
  if (options.startApp !== false) await firstStart()

  return {
    url,
    dir,
    databaseUrl,
    mail,
    s3,
    env,
    log: () => app?.output() ?? '',
    restartApp: async () => {
      await stopApp()
      await startApp()
    },
    stop: async () => {
      await stopApp()
      await mail.stop()
      await s3.stop()
      rmSync(dir, { recursive: true, force: true })
    },
  }
}
