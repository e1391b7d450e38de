import { findMigrationsFolder, migrateDatabase, openDatabase, type Database } from '../db/client'

let database: Promise<Database> | undefined

/** The one way to reach the database: opened and migrated once per process. */
export function useDb(): Promise<Database> {
  database ??= (async () => {
    const config = useServerConfig()
    const db = await openDatabase(config.databaseUrl, config.databaseAuthToken)
    await migrateDatabase(db, findMigrationsFolder(config.migrationsDir))
    return db
  })()
  return database
}

/** Closes the connection at a graceful stop, after the last request and job have finished. */
export async function closeDb() {
  if (!database) return
  const db = await database.catch(() => undefined)
  database = undefined
  db?.$client.close()
}

/**
 * A statement built once per database (Drizzle's `.prepare()` with `sql.placeholder` arguments) instead of on
 * every request: building a query costs more than running it on a small indexed lookup (docs/performance.md).
 */
export function builtOnce<T>(build: (db: Database) => T): (db: Database) => T {
  const built = new WeakMap<Database, T>()
  return (db) => {
    let statement = built.get(db)
    if (!statement) {
      statement = build(db)
      built.set(db, statement)
    }
    return statement
  }
}

export * as tables from '../db/schema'
