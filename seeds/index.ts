import { migrateDatabase, openDatabase } from '../server/db/client'
import { seedClub } from './club'
import type { SeedStep } from './context'
import { seedExercises } from './exercises'
import { seedPlayer } from './player'
import { seedRoutines } from './routines'

// Each later part of the demo adds its own step here, in the order its data depends on.
const steps: SeedStep[] = [seedExercises, seedRoutines, seedPlayer]

async function main() {
  const url = process.env.DATABASE_URL ?? 'file:.data/switchback.db'
  const db = await openDatabase(url)
  await migrateDatabase(db)
  const log = (line: string) => console.log(`  seeded ${line}`)
  const context = await seedClub(db, log)
  for (const step of steps) await step(context)
  db.$client.close()
  console.log(`Seeded ${url}`)
}

main().catch((error) => {
  console.error(error)
  process.exit(1)
})
