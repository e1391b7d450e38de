import { createHash } from 'node:crypto'
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises'
import { join } from 'node:path'
import sharp from 'sharp'
import { svgToVp8, vp8FramesToWebm } from './clip'
import { figureSvg, type FigureStyle, type Movement } from './figure'

export interface FigureClipOptions {
  framesPerSecond?: number
  width?: number
  height?: number
  /** Target length; whole cycles are used, so the clip loops without a jump (3–6 s). */
  aboutSeconds?: number
  /** Rendered files are kept here by a hash of everything that shapes them. */
  cacheDir?: string
}

export interface FigureClip {
  webm: Buffer
  poster: Buffer
  durationSeconds: number
  width: number
  height: number
  fromCache: boolean
}

// Bump when the drawing changes, so cached files are redrawn.
const DRAWING_VERSION = 1

/** How many frames one cycle takes and how many cycles make a 3–6 s clip. */
export function clipPlan(cycleSeconds: number, framesPerSecond: number, aboutSeconds = 4.5) {
  const cycleFrames = Math.max(1, Math.round(cycleSeconds * framesPerSecond))
  const cycleLength = cycleFrames / framesPerSecond
  let cycles = Math.max(1, Math.round(aboutSeconds / cycleLength))
  while (cycles > 1 && cycles * cycleLength > 6) cycles -= 1
  while (cycles * cycleLength < 3) cycles += 1
  return { cycleFrames, cycles, totalFrames: cycleFrames * cycles, durationSeconds: (cycleFrames * cycles) / framesPerSecond }
}

/**
 * The figure performing a movement as a looping WebM (VP8): one cycle is drawn and encoded, and the
 * clip repeats those frames, since every frame is a key frame. The poster is a JPEG of the first frame.
 */
export async function renderFigureClip(movement: Movement, style: FigureStyle, options: FigureClipOptions = {}): Promise<FigureClip> {
  const { framesPerSecond = 24, width = 320, height = 240, aboutSeconds = 4.5, cacheDir = '.data/clip-cache' } = options
  const plan = clipPlan(movement.cycleSeconds, framesPerSecond, aboutSeconds)
  const hash = createHash('sha256').update(JSON.stringify({ DRAWING_VERSION, movement, style, framesPerSecond, width, height, plan })).digest('hex').slice(0, 32)
  const webmPath = join(cacheDir, `${hash}.webm`)
  const posterPath = join(cacheDir, `${hash}.jpg`)
  const result = { durationSeconds: plan.durationSeconds, width, height }
  try {
    const [webm, poster] = await Promise.all([readFile(webmPath), readFile(posterPath)])
    return { webm, poster, ...result, fromCache: true }
  }
  catch {
    // Not rendered yet.
  }

  const frameSvg = (index: number) => figureSvg(movement, (index / plan.cycleFrames) * movement.cycleSeconds, style, width, height)
  const cycle: Uint8Array[] = []
  const batch = 6
  for (let start = 0; start < plan.cycleFrames; start += batch) {
    const indexes = Array.from({ length: Math.min(batch, plan.cycleFrames - start) }, (_, offset) => start + offset)
    cycle.push(...await Promise.all(indexes.map(index => svgToVp8(frameSvg(index), 60))))
  }
  const frames = Array.from({ length: plan.totalFrames }, (_, index) => cycle[index % plan.cycleFrames]!)
  const webm = await vp8FramesToWebm(frames, framesPerSecond, width, height)
  const poster = await sharp(Buffer.from(frameSvg(0))).jpeg({ quality: 80 }).toBuffer()

  await mkdir(cacheDir, { recursive: true })
  // Written under a temporary name first, so a cut-short seed never leaves half a file in the cache.
  await writeFile(`${webmPath}.part`, webm)
  await writeFile(`${posterPath}.part`, poster)
  await rename(`${webmPath}.part`, webmPath)
  await rename(`${posterPath}.part`, posterPath)
  return { webm, poster, ...result, fromCache: false }
}
