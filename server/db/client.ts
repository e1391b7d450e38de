import { existsSync, mkdirSync } from 'node:fs'
import { dirname, resolve } from 'node:path'
import { createClient, type Client } from '@libsql/client'
import { drizzle, type LibSQLDatabase } from 'drizzle-orm/libsql'
import { migrate } from 'drizzle-orm/libsql/migrator'
import * as schema from './schema'

export type Database = LibSQLDatabase<typeof schema> & { $client: Client }

export const defaultDatabaseUrl = 'file:.data/switchback.db'

/**
 * Opens a database by URL. Plain Node (no Nuxt), so scripts, seeds and benchmarks share it; the server
 * passes its config (server/utils/db.ts), scripts pass their own environment.
 */
export async function openDatabase(url = defaultDatabaseUrl, authToken?: string): Promise<Database> {
  if (url.startsWith('file:')) {
    // libSQL does not create folders for a file database.
    const file = url.slice('file:'.length)
    mkdirSync(dirname(resolve(file)), { recursive: true })
  }
  const client = createClient({ url, authToken })
  if (url.startsWith('file:')) {
    await client.execute('PRAGMA journal_mode = WAL')
    await client.execute('PRAGMA busy_timeout = 5000')
    await client.execute('PRAGMA synchronous = NORMAL')
  }
  await client.execute('PRAGMA foreign_keys = ON')
  return drizzle(client, { schema }) as Database
}

/** The source folder in development and tests; the built server's own copy in production. */
export function findMigrationsFolder(configured?: string): string {
  const candidates = [
    configured,
    resolve(process.cwd(), 'server/db/migrations'),
    process.argv[1] ? resolve(dirname(process.argv[1]), 'migrations') : undefined,
  ].filter((path): path is string => Boolean(path))
  const found = candidates.find(path => existsSync(resolve(path, 'meta/_journal.json')))
  if (!found) throw new Error(`No migrations found (looked in ${candidates.join(', ')})`)
  return found
}

export async function migrateDatabase(db: Database, folder = findMigrationsFolder()) {
  await migrate(db, { migrationsFolder: folder })
}
