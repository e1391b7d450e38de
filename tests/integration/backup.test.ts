import { execFile } from 'node:child_process'
import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { promisify } from 'node:util'
import { PutObjectCommand, S3Client } from '@aws-sdk/client-s3'
import { createClient, type Client } from '@libsql/client'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { logEverything, seedLoggingAthletes } from '../support/logging-athletes'
import { startReplicas, type Replicas } from '../support/replicas'
import { root } from '../support/stack'

const run = promisify(execFile)
let replicas: Replicas
let db: Client

beforeAll(async () => {
  replicas = await startReplicas(1)
  db = createClient({ url: replicas.stack.databaseUrl, timeout: 5000 })
}, 120_000)

afterAll(async () => {
  db?.close()
  await replicas?.stop()
})

function script(name: string, args: string[]) {
  return run(join(root, 'node_modules/.bin/tsx'), [join(root, 'scripts', name), ...args], { cwd: root, env: replicas.stack.env })
    .then(result => ({ code: 0, ...result }), (error: { code: number, stdout: string, stderr: string }) => ({ code: error.code, stdout: error.stdout, stderr: error.stderr }))
}

const entryCount = async (database: Client) => Number((await database.execute('select count(*) as n from entry_logs')).rows[0]!.n)

describe('backup and restore', () => {
  it('copies a live database consistently, lists the clips, and restores into a stopped deployment', async () => {
    const { teamId, athletes } = await seedLoggingAthletes(replicas.stack.databaseUrl, replicas.url, 5, 40)
    const store = new S3Client({ endpoint: replicas.stack.s3.endpoint, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } })
    const kept = `teams/${teamId}/exercises/1/kept.webm`
    const lost = `teams/${teamId}/exercises/2/lost.webm`
    await store.send(new PutObjectCommand({ Bucket: replicas.stack.s3.bucket, Key: kept, Body: Buffer.from('clip bytes'), ContentType: 'video/webm' }))
    store.destroy()
    await db.execute({ sql: `insert into media_objects (team_id, key, content_type, size, status) values (?, ?, 'video/webm', 10, 'ready'), (?, ?, 'video/webm', 10, 'ready')`, args: [teamId, kept, teamId, lost] })

    // The backup runs while athletes are logging.
    const before = await entryCount(db)
    const logging = logEverything(athletes)
    const out = join(replicas.stack.dir, 'backups')
    const backup = await script('db-backup.ts', ['--out', out])
    await logging
    const after = await entryCount(db)
    expect(backup.code, backup.stderr).toBe(0)

    const files = readdirSync(out)
    const copy = files.find(file => /^switchback-\d{8}T\d{6}Z\.db$/.test(file))!
    expect(copy).toBeDefined()
    const manifest = JSON.parse(readFileSync(join(out, copy.replace(/\.db$/, '.json')), 'utf8'))
    expect(manifest.database.integrity).toBe('ok')
    expect(manifest.clips.objects.map((object: { key: string }) => object.key)).toEqual([kept])
    const inCopy = manifest.database.rowCounts.entry_logs as number
    expect(inCopy).toBeGreaterThanOrEqual(before)
    expect(inCopy).toBeLessThanOrEqual(after)

    // Refused while the app still answers: it would keep writing to the file it has open.
    const refused = await script('db-restore.ts', [join(out, copy)])
    expect(refused.code).toBe(1)
    expect(refused.stderr).toMatch(/still answering/)

    await replicas.apps[0]!.stop()
    const restored = await script('db-restore.ts', [join(out, copy)])
    expect(restored.code, restored.stderr).toBe(0)
    expect(restored.stdout).toMatch(/1 of 2 clips are missing/)
    expect(restored.stdout).toContain(`missing: ${lost}`)
    const dbFile = replicas.stack.databaseUrl.slice('file:'.length)
    expect(readdirSync(replicas.stack.dir).some(file => file.startsWith('test.db.before-restore-'))).toBe(true)
    expect(existsSync(dbFile)).toBe(true)

    await replicas.restart(0)
    const fresh = createClient({ url: replicas.stack.databaseUrl })
    expect(await entryCount(fresh)).toBe(inCopy)
    fresh.close()
    const health = await fetch(`${replicas.url}/api/health/ready`)
    expect(health.status).toBe(200)
  }, 180_000)

  it('refuses a damaged backup and changes nothing', async () => {
    const damaged = join(replicas.stack.dir, 'damaged.db')
    const { writeFileSync } = await import('node:fs')
    writeFileSync(damaged, 'SQLite format 3\u0000 this is not a database')
    await replicas.apps[0]!.stop()
    const before = readFileSync(replicas.stack.databaseUrl.slice('file:'.length))
    const result = await script('db-restore.ts', [damaged])
    expect(result.code).not.toBe(0)
    expect(readFileSync(replicas.stack.databaseUrl.slice('file:'.length)).equals(before)).toBe(true)
    await replicas.restart(0)
  }, 60_000)
})
