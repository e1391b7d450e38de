// Writes the demo clips the starter set copies into a new team (server/assets/starter-clips/*.webm).
// Run once after changing a starter exercise's clip style: `npx tsx scripts/starter-clips.ts`.
import { mkdirSync, writeFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { makeDemoClip } from '../seeds/clip'
import { starterExercises, starterSlug } from '../server/starter/exercises'

const folder = resolve(import.meta.dirname, '../server/assets/starter-clips')
mkdirSync(folder, { recursive: true })
for (const exercise of starterExercises) {
  if (!exercise.clip) continue
  const body = await makeDemoClip({ seconds: 3, ...exercise.clip })
  writeFileSync(resolve(folder, `${starterSlug(exercise.name)}.webm`), body)
  console.log(`${starterSlug(exercise.name)}.webm ${body.byteLength} bytes`)
}
