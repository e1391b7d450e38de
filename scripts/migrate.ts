import { migrateDatabase, openDatabase } from '../server/db/client'

const url = process.env.DATABASE_URL ?? 'file:.data/switchback.db'
const db = await openDatabase(url, process.env.DATABASE_AUTH_TOKEN)
await migrateDatabase(db)
db.$client.close()
console.log(`Migrated ${url}`)
