// Drawing every starter exercise's demo clip: once from nothing into a temporary cache, then again from
// that cache, as a re-seed would. Prints the time of each pass, frames drawn and the clips' sizes.
// Run with `npx tsx bench/demo-clips.ts`.
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { starterExercises } from '../server/starter/exercises'
import { figureStyles } from '../seeds/figure'
import { clipPlan, renderFigureClip } from '../seeds/figure-clip'
import { exerciseMovements } from '../seeds/movements'

async function pass(cacheDir: string) {
  const started = performance.now()
  let bytes = 0
  let frames = 0
  let fromCache = 0
  for (const exercise of starterExercises) {
    const movement = exerciseMovements[exercise.name]!.movement
    const clip = await renderFigureClip(movement, figureStyles[exercise.category]!, { cacheDir })
    bytes += clip.webm.byteLength
    frames += clip.fromCache ? 0 : clipPlan(movement.cycleSeconds, 24).cycleFrames
    if (clip.fromCache) fromCache += 1
  }
  return { seconds: (performance.now() - started) / 1000, bytes, frames, fromCache }
}

async function main() {
  const cacheDir = mkdtempSync(join(tmpdir(), 'switchback-clip-cache-'))
  try {
    const cold = await pass(cacheDir)
    const warm = await pass(cacheDir)
    console.log(`${starterExercises.length} demo clips, 320×240 at 24 fps`)
    console.log(`drawn:      ${cold.seconds.toFixed(1)} s, ${cold.frames} frames encoded, ${(cold.bytes / 1024 / 1024).toFixed(1)} MB of WebM`)
    console.log(`from cache: ${warm.seconds.toFixed(2)} s (${warm.fromCache} of ${starterExercises.length} cached)`)
  }
  finally {
    rmSync(cacheDir, { recursive: true, force: true })
  }
}

main().catch((error) => {
  console.error(error)
  process.exit(1)
})
