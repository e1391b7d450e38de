// npm run db:backup [-- --out DIR]: a consistent copy of the live database, taken while the app runs,
// with a manifest beside it listing the row counts and every clip object the store holds.
import { mkdirSync, statSync, writeFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { parseArgs } from 'node:util'
import { createClient } from '@libsql/client'
import { checkIntegrity, listStoredObjects, localDatabaseFile, storeSettings, timestampForFile } from './backup-support'

const { values } = parseArgs({ options: { out: { type: 'string' } } })
const databaseUrl = process.env.DATABASE_URL ?? 'file:.data/switchback.db'
const source = localDatabaseFile(databaseUrl)
const folder = resolve(values.out ?? process.env.BACKUP_DIR ?? '.data/backups')
mkdirSync(folder, { recursive: true })
const name = `switchback-${timestampForFile(new Date())}`
const target = join(folder, `${name}.db`)

const started = Date.now()
const client = createClient({ url: `file:${source}`, timeout: 30_000 })
// VACUUM INTO reads one snapshot of the database (a read transaction), so writers carry on and the copy
// is consistent: everything committed before it started, nothing after.
await client.execute({ sql: 'VACUUM INTO ?', args: [target] })
const tables = (await client.execute(`select name from sqlite_master where type = 'table' and name not like 'sqlite_%' order by name`)).rows.map(row => String(row.name))
client.close()

const copy = createClient({ url: `file:${target}` })
const integrity = await checkIntegrity(copy)
const rowCounts: Record<string, number> = {}
for (const table of tables) rowCounts[table] = Number((await copy.execute(`select count(*) as n from "${table}"`)).rows[0]!.n)
const migrations = (await copy.execute('select hash, created_at from __drizzle_migrations order by created_at')).rows.map(row => ({ hash: String(row.hash), createdAt: Number(row.created_at) }))
copy.close()
if (integrity !== 'ok') throw new Error(`The copy failed its integrity check: ${integrity}`)

let clips: { bucket: string, objects: { key: string, size: number, etag: string | null }[] } | { error: string }
try {
  clips = { bucket: storeSettings().bucket, objects: await listStoredObjects() }
}
catch (error) {
  clips = { error: `The clip store could not be listed: ${(error as Error).message}` }
}

const manifest = {
  createdAt: new Date().toISOString(),
  database: { file: `${name}.db`, bytes: statSync(target).size, integrity, migrations, rowCounts },
  clips,
}
writeFileSync(join(folder, `${name}.json`), `${JSON.stringify(manifest, null, 2)}\n`)
console.log(`Backed up ${source} to ${target} in ${Date.now() - started} ms (integrity ${integrity}; ${'objects' in clips ? `${clips.objects.length} clip objects listed` : clips.error}).`)
