import { existsSync, mkdirSync } from 'node:fs'
import { dirname, resolve } from 'node:path'
import { createClient, type Client } from '@libsql/client'
import { drizzle, type LibSQLDatabase } from 'drizzle-orm/libsql'
import { migrate } from 'drizzle-orm/libsql/migrator'
import { withPreparedReads } from './prepared-reads'
import { recyclingClient } from './recycling-client'
import * as schema from './schema'

export type Database = LibSQLDatabase<typeof schema> & { $client: Client }

/** How long a write waits for another process's lock before the request answers 503. */
export const BUSY_TIMEOUT_MS = 5000
/**
 * How long one try waits for a lock inside libSQL, where the wait stops the whole process; the rest of
 * BUSY_TIMEOUT_MS is spent in pauses on the event loop between tries (server/db/recycling-client.ts).
 */
const LOCK_TRY_MS = 25

export const defaultDatabaseUrl = 'file:.data/switchback.db'

/**
 * Opens a database by URL. Plain Node (no Nuxt), so scripts, seeds and benchmarks share it; the server
 * passes its config (server/utils/db.ts), scripts pass their own environment.
 */
export async function openDatabase(url = defaultDatabaseUrl, authToken?: string, lockPatienceMs = BUSY_TIMEOUT_MS): Promise<Database> {
  if (url.startsWith('file:')) {
    // libSQL does not create folders for a file database.
    const file = url.slice('file:'.length)
    mkdirSync(dirname(resolve(file)), { recursive: true })
  }
  // The client keeps a pool of connections (a transaction holds its own), and a PRAGMA reaches only the
  // connection that ran it: the busy timeout goes in the options so that every connection waits for a
  // lock instead of failing at once. WAL is a property of the file, so setting it once is enough.
  // A local file waits for locks in short tries with pauses between them; a remote server waits itself.
  const file = localFilePath(url)
  const client = file
    ? recyclingClient(() => withPreparedReads(createClient({ url, authToken, timeout: LOCK_TRY_MS }), file, LOCK_TRY_MS), lockPatienceMs)
    : url.startsWith('file:')
      ? recyclingClient(() => createClient({ url, authToken, timeout: LOCK_TRY_MS }), lockPatienceMs)
      : createClient({ url, authToken, timeout: BUSY_TIMEOUT_MS })
  if (url.startsWith('file:')) {
    await client.execute('PRAGMA journal_mode = WAL')
  }
  await client.execute('PRAGMA foreign_keys = ON')
  return drizzle(client, { schema }) as Database
}

/** The file a plain `file:` URL names (no query options, not in memory), for a connection of our own. */
function localFilePath(url: string) {
  if (!url.startsWith('file:') || url.includes('?')) return undefined
  let path = url.slice('file:'.length)
  if (path.startsWith('//')) path = path.slice(2).replace(/^localhost(?=\/)/, '')
  return path && path !== ':memory:' ? path : undefined
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
