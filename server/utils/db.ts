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

export * as tables from '../db/schema'
