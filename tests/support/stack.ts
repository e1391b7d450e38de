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
  s3: { endpoint: string, bucket: string, stop: () => Promise<void> }
  env: Record<string, string>
  /** What the app server has printed since it (re)started. */
  log: () => string
  /** Stops and starts the app server again on the same port and database. */
  restartApp: () => Promise<void>
  stop: () => Promise<void>
}

async function waitForServer(url: string, child: ChildProcess, log: () => string) {
  const deadline = Date.now() + 30_000
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`App server exited early:\n${log()}`)
    try {
      const response = await fetch(`${url}/api/health`)
      if (response.ok) return
    }
    catch {
      // not listening yet
    }
    await new Promise(r => setTimeout(r, 100))
  }
  throw new Error(`App server did not start:\n${log()}`)
}

/**
 * The real built server (`.output`, from `npm run build`) against a temporary SQLite file,
 * a real S3-compatible store (s3rver) and an in-process SMTP catcher, each on a free port.
 */
export async function startStack(extraEnv: Record<string, string> = {}): Promise<Stack> {
  const dir = mkdtempSync(join(tmpdir(), 'switchback-test-'))
  const [appPort, smtpPort, s3Port] = [await freePort(), await freePort(), await freePort()]
  const mail = new MailCatcher(smtpPort)
  await mail.start()

  writeFileSync(join(dir, 'cors.xml'), corsXml)
  const s3rver = new S3rver({
    port: s3Port,
    address: '127.0.0.1',
    silent: true,
    directory: join(dir, 's3'),
    configureBuckets: [{ name: S3_BUCKET, configs: [corsXml] }],
  })
  await s3rver.run()
  const s3 = { endpoint: `http://127.0.0.1:${s3Port}`, bucket: S3_BUCKET, stop: () => s3rver.close() }

  const url = `http://127.0.0.1:${appPort}`
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

  let child: ChildProcess
  let output = ''
  async function startApp() {
    output = ''
    child = spawn(process.execPath, [join(root, '.output/server/index.mjs')], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] })
    const collect = (chunk: Buffer) => {
      output += chunk.toString()
    }
    child.stdout?.on('data', collect)
    child.stderr?.on('data', collect)
    await waitForServer(url, child, () => output)
  }
  async function stopApp() {
    if (child.exitCode !== null) return
    await new Promise<void>((resolveExit) => {
      child.once('exit', () => resolveExit())
      child.kill('SIGTERM')
      setTimeout(() => child.kill('SIGKILL'), 5000).unref()
    })
  }
  await startApp()

  return {
    url,
    dir,
    databaseUrl,
    mail,
    s3,
    env,
    log: () => output,
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
