import sharp from 'sharp'
import { BufferTarget, EncodedPacket, EncodedVideoPacketSource, Output, WebMOutputFormat } from 'mediabunny'

export interface ClipOptions {
  /** Seconds of video. */
  seconds?: number
  framesPerSecond?: number
  width?: number
  height?: number
  /** Background and marker colours (CSS colours), so each demo clip looks a little different. */
  background?: string
  marker?: string
  /** How the marker moves: along the ground, up a slope, or bouncing in place. */
  motion?: 'run' | 'climb' | 'bounce'
}

function frameSvg(progress: number, options: Required<ClipOptions>) {
  const { width, height, background, marker, motion } = options
  const ground = height * 0.8
  const radius = height * 0.08
  let x = width * (0.1 + 0.8 * progress)
  let y = ground - radius
  let groundLine = `<line x1="0" y1="${ground}" x2="${width}" y2="${ground}" stroke="#ffffff" stroke-width="3" />`
  if (motion === 'climb') {
    const rise = height * 0.5
    y = ground - radius - rise * progress
    groundLine = `<line x1="${width * 0.1}" y1="${ground}" x2="${width * 0.9}" y2="${ground - rise}" stroke="#ffffff" stroke-width="3" />`
  }
  if (motion === 'bounce') {
    x = width / 2
    y = ground - radius - Math.abs(Math.sin(progress * Math.PI * 4)) * height * 0.45
  }
  return Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}">
    <rect width="100%" height="100%" fill="${background}" />
    ${groundLine}
    <circle cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" r="${radius}" fill="${marker}" />
    <rect x="0" y="${height - 6}" width="${(width * progress).toFixed(1)}" height="6" fill="${marker}" />
  </svg>`)
}

/** The VP8 bitstream inside a simple (lossy, no alpha) WebP file: the `VP8 ` chunk of its RIFF container. */
function vp8FromWebp(webp: Buffer): Uint8Array {
  if (webp.toString('ascii', 0, 4) !== 'RIFF' || webp.toString('ascii', 8, 12) !== 'WEBP') throw new Error('Not a WebP file')
  let offset = 12
  while (offset + 8 <= webp.length) {
    const fourcc = webp.toString('ascii', offset, offset + 4)
    const size = webp.readUInt32LE(offset + 4)
    if (fourcc === 'VP8 ') return new Uint8Array(webp.subarray(offset + 8, offset + 8 + size))
    offset += 8 + size + (size % 2)
  }
  throw new Error('The WebP file has no lossy VP8 frame')
}

/**
 * A short, real WebM (VP8) video made on the spot, with no external encoder: every frame is drawn as
 * SVG, encoded by libwebp (through sharp) as a lossy WebP, whose VP8 key frame is written into a
 * WebM container by mediabunny. Browsers play it and report its duration.
 */
export async function makeDemoClip(input: ClipOptions = {}): Promise<Buffer> {
  const options: Required<ClipOptions> = {
    seconds: 2,
    framesPerSecond: 12,
    width: 320,
    height: 180,
    background: '#1f4d3a',
    marker: '#e37842',
    motion: 'run',
    ...input,
  }
  const count = Math.max(1, Math.round(options.seconds * options.framesPerSecond))
  const frames: Uint8Array[] = []
  for (let index = 0; index < count; index++) frames.push(await svgToVp8(frameSvg(index / Math.max(1, count - 1), options)))
  return vp8FramesToWebm(frames, options.framesPerSecond, options.width, options.height)
}

/** One SVG frame as a VP8 key frame (through libwebp's lossy WebP). */
export async function svgToVp8(svg: Buffer | string, quality = 70): Promise<Uint8Array> {
  const webp = await sharp(Buffer.isBuffer(svg) ? svg : Buffer.from(svg))
    .removeAlpha()
    .webp({ quality, lossless: false, nearLossless: false, smartSubsample: false })
    .toBuffer()
  return vp8FromWebp(webp)
}

/** VP8 key frames, one after another at a fixed rate, in a WebM container (mediabunny writes it). */
export async function vp8FramesToWebm(frames: Uint8Array[], framesPerSecond: number, width: number, height: number): Promise<Buffer> {
  const frameDuration = 1 / framesPerSecond
  const output = new Output({ format: new WebMOutputFormat(), target: new BufferTarget() })
  const source = new EncodedVideoPacketSource('vp8')
  output.addVideoTrack(source, { frameRate: framesPerSecond })
  await output.start()
  for (const [index, frame] of frames.entries()) {
    const packet = new EncodedPacket(frame, 'key', index * frameDuration, frameDuration)
    await source.add(packet, index === 0
      ? { decoderConfig: { codec: 'vp8', codedWidth: width, codedHeight: height } }
      : undefined)
  }
  source.close()
  await output.finalize()
  const buffer = output.target.buffer
  if (!buffer) throw new Error('The clip could not be written')
  return Buffer.from(buffer)
}
