import { HeadBucketCommand } from '@aws-sdk/client-s3'
import { sql } from 'drizzle-orm'

export interface PartHealth {
  ok: boolean
  /** Why it failed, in plain words; never a stack or a secret. */
  problem?: string
  checkedAt: string
  ms: number
}

const CHECK_TIMEOUT_MS = 2000

async function timed(check: () => Promise<unknown>, problem: string): Promise<PartHealth> {
  const started = performance.now()
  let timer: ReturnType<typeof setTimeout> | undefined
  try {
    await Promise.race([
      check(),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('timed out')), CHECK_TIMEOUT_MS)
      }),
    ])
    return { ok: true, checkedAt: new Date().toISOString(), ms: Math.round(performance.now() - started) }
  }
  catch {
    return { ok: false, problem, checkedAt: new Date().toISOString(), ms: Math.round(performance.now() - started) }
  }
  finally {
    clearTimeout(timer)
  }
}

export function checkDatabase() {
  return timed(async () => {
    const db = await useDb()
    await db.run(sql`select 1`)
  }, 'The database does not answer.')
}

// The store and the mail relay are asked at most every ten seconds, whatever the health traffic:
// a load balancer polling often must not become load on them.
const remembered = new Map<string, { result: PartHealth, at: number, pending?: Promise<PartHealth> }>()

async function rememberedCheck(name: string, check: () => Promise<PartHealth>) {
  const entry = remembered.get(name)
  if (entry && Date.now() - entry.at < useServerConfig().healthCheckIntervalMs) return entry.result
  if (entry?.pending) return entry.result
  const pending = check().then((result) => {
    remembered.set(name, { result, at: Date.now() })
    return result
  })
  if (entry) {
    entry.pending = pending
    return entry.result
  }
  return pending
}

export function checkObjectStore() {
  return rememberedCheck('objectStore', () => timed(async () => {
    const { server, bucket } = useObjectStore()
    await server.send(new HeadBucketCommand({ Bucket: bucket }))
  }, 'The clip store cannot be reached: uploads and playback answer 503 until it is back.'))
}

export function checkMail() {
  return rememberedCheck('mail', () => timed(
    () => useTransport().verify(),
    'The mail relay cannot be reached: messages wait in the outbox and go out when it is back.',
  ))
}
