import { migrateDatabase, openDatabase } from '../server/db/client'
import { seedBlocks } from './blocks'
import { seedClub } from './club'
import type { SeedStep } from './context'
import { seedExercises } from './exercises'
import { seedInsights } from './insights'
import { seedPlan } from './plan'
import { seedPlayer } from './player'
import { seedReviews } from './reviews'
import { seedRoutines } from './routines'

// Each later part of the demo adds its own step here, in the order its data depends on:
// six weeks of logged history first, then the current block, then this week's logged sessions.
const steps: SeedStep[] = [seedExercises, seedRoutines, seedInsights, seedPlan, seedPlayer, seedBlocks, seedReviews]

async function main() {
  const url = process.env.DATABASE_URL ?? 'file:.data/switchback.db'
  const db = await openDatabase(url, process.env.DATABASE_AUTH_TOKEN)
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
