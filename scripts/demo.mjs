// One command for the whole local stack: object store, mail catcher, migrate + seed, build, app.
// Everything runs in this one process group; Ctrl-C stops it all.
import { spawn } from 'node:child_process'
import { mkdirSync } from 'node:fs'
import { resolve } from 'node:path'
import S3rver from 's3rver'

const root = resolve(import.meta.dirname, '..')
const bin = name => resolve(root, 'node_modules/.bin', name)

const env = {
  ...process.env,
  DATABASE_URL: process.env.DATABASE_URL ?? 'file:.data/switchback.db',
  NUXT_SESSION_PASSWORD: process.env.NUXT_SESSION_PASSWORD ?? 'demo-only-session-password-change-me-in-production',
  APP_URL: process.env.APP_URL ?? 'http://localhost:3000',
  SMTP_URL: process.env.SMTP_URL ?? 'smtp://127.0.0.1:1025',
  MAIL_FROM: process.env.MAIL_FROM ?? 'Switchback <no-reply@larchford.example>',
  S3_ENDPOINT: process.env.S3_ENDPOINT ?? 'http://127.0.0.1:4569',
  S3_REGION: process.env.S3_REGION ?? 'us-east-1',
  S3_BUCKET: process.env.S3_BUCKET ?? 'switchback-media',
  S3_ACCESS_KEY_ID: process.env.S3_ACCESS_KEY_ID ?? 'S3RVER',
  S3_SECRET_ACCESS_KEY: process.env.S3_SECRET_ACCESS_KEY ?? 'S3RVER',
  PORT: process.env.PORT ?? '3000',
}

const children = new Set()
let s3

function run(command, args, { wait = true } = {}) {
  const child = spawn(command, args, { cwd: root, env, stdio: 'inherit' })
  children.add(child)
  child.on('exit', () => children.delete(child))
  if (!wait) return child
  return new Promise((resolveRun, reject) => {
    child.on('exit', code => (code === 0 ? resolveRun() : reject(new Error(`${command} ${args.join(' ')} exited with ${code}`))))
  })
}

async function shutdown(code = 0) {
  for (const child of children) child.kill('SIGTERM')
  await s3?.close().catch(() => {})
  process.exit(code)
}
process.on('SIGINT', () => shutdown(0))
process.on('SIGTERM', () => shutdown(0))

const cors = '<CORSConfiguration><CORSRule><AllowedOrigin>*</AllowedOrigin><AllowedMethod>GET</AllowedMethod><AllowedMethod>PUT</AllowedMethod><AllowedMethod>HEAD</AllowedMethod><AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds></CORSRule></CORSConfiguration>'

try {
  mkdirSync(resolve(root, '.data/s3'), { recursive: true })
  const s3Port = Number(new URL(env.S3_ENDPOINT).port)
  s3 = new S3rver({ port: s3Port, address: '127.0.0.1', silent: true, directory: resolve(root, '.data/s3'), configureBuckets: [{ name: env.S3_BUCKET, configs: [cors] }] })
  await s3.run()
  console.log(`Object store (s3rver) at ${env.S3_ENDPOINT}, bucket ${env.S3_BUCKET}`)

  const smtpPort = new URL(env.SMTP_URL).port || '1025'
  run(bin('maildev'), ['--smtp', smtpPort, '--web', '1080', '--ip', '127.0.0.1', '--web-ip', '127.0.0.1', '--silent'], { wait: false })
  console.log('Mail catcher (maildev) inbox at http://127.0.0.1:1080')

  await run(bin('tsx'), ['seeds/index.ts'])
  await run(bin('nuxt'), ['build'])
  const app = run(process.execPath, ['.output/server/index.mjs'], { wait: false })
  app.on('exit', code => shutdown(code ?? 0))
  console.log(`\nSwitchback is starting at http://localhost:${env.PORT} — sign in with the demo accounts in the README.\n`)
}
catch (error) {
  console.error(error)
  await shutdown(1)
}
