// npm run db:restore -- FILE [--force]: puts a backup in place of the database of a stopped deployment,
// after checking the backup's integrity, and reports clips that the store no longer holds.
import { copyFileSync, existsSync, readFileSync, renameSync, rmSync } from 'node:fs'
import { resolve } from 'node:path'
import { parseArgs } from 'node:util'
import { createClient } from '@libsql/client'
import { checkIntegrity, listStoredObjects, localDatabaseFile, timestampForFile } from './backup-support'

const { values, positionals } = parseArgs({ allowPositionals: true, options: { force: { type: 'boolean', default: false } } })
const backup = positionals[0] ? resolve(positionals[0]) : undefined
if (!backup || !existsSync(backup)) {
  console.error('Usage: npm run db:restore -- FILE [--force]   (FILE is a .db written by npm run db:backup)')
  process.exit(2)
}
const databaseUrl = process.env.DATABASE_URL ?? 'file:.data/switchback.db'
const target = localDatabaseFile(databaseUrl)
const appUrl = process.env.APP_URL ?? 'http://localhost:3000'

// A running app would keep writing to the file it has open: the deployment must be stopped first.
const answering = await fetch(new URL('/api/health/live', appUrl), { signal: AbortSignal.timeout(1500) }).then(response => response.ok, () => false)
if (answering && !values.force) {
  console.error(`The app at ${appUrl} is still answering. Stop every app process first (or pass --force if that address is another deployment).`)
  process.exit(1)
}

const check = createClient({ url: `file:${backup}` })
const integrity = await checkIntegrity(check)
const expected = (await check.execute(`select key from media_objects where status = 'ready'`)).rows.map(row => String(row.key))
check.close()
if (integrity !== 'ok') {
  console.error(`The backup failed its integrity check, nothing was changed: ${integrity}`)
  process.exit(1)
}

if (existsSync(target)) {
  const kept = `${target}.before-restore-${timestampForFile(new Date())}`
  renameSync(target, kept)
  console.log(`The database that was there is kept as ${kept}`)
}
for (const suffix of ['-wal', '-shm']) rmSync(`${target}${suffix}`, { force: true })
copyFileSync(backup, target)
console.log(`Restored ${backup} to ${target} (integrity ${integrity}).`)

const manifestFile = backup.replace(/\.db$/, '.json')
const manifest = existsSync(manifestFile) ? JSON.parse(readFileSync(manifestFile, 'utf8')) as { createdAt?: string } : undefined
if (manifest?.createdAt) console.log(`The backup was taken at ${manifest.createdAt}.`)
try {
  const stored = new Set((await listStoredObjects()).map(object => object.key))
  const missing = expected.filter(key => !stored.has(key))
  if (missing.length) {
    console.log(`${missing.length} of ${expected.length} clips are missing from the store (their exercises will show no clip until uploaded again):`)
    for (const key of missing) console.log(`  missing: ${key}`)
  }
  else {
    console.log(`All ${expected.length} clips are in the store.`)
  }
}
catch (error) {
  console.log(`The clip store could not be checked (${(error as Error).message}); check the clips once it is reachable.`)
}
