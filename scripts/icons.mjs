// Renders the app icons in public/icons from assets/app-icon.svg (run after changing the drawing;
// the PNGs are committed). "any" icons keep the drawing edge to edge; "maskable" ones shrink it
// into the centre 80 % so a launcher's round or squircle mask never cuts the road.
import { mkdir, readFile } from 'node:fs/promises'
import { resolve } from 'node:path'
import sharp from 'sharp'

const root = resolve(import.meta.dirname, '..')
const svg = await readFile(resolve(root, 'assets/app-icon.svg'))
const out = resolve(root, 'public/icons')
await mkdir(out, { recursive: true })

for (const size of [64, 192, 512]) {
  await sharp(svg, { density: 300 }).resize(size, size).png().toFile(resolve(out, `icon-${size}.png`))
}
await sharp(svg, { density: 300 }).resize(180, 180).png().toFile(resolve(out, 'apple-touch-icon-180.png'))
for (const size of [192, 512]) {
  const inner = Math.round(size * 0.8)
  const drawing = await sharp(svg, { density: 300 }).resize(inner, inner).png().toBuffer()
  await sharp({ create: { width: size, height: size, channels: 4, background: '#1f4d3a' } })
    .composite([{ input: drawing, gravity: 'center' }])
    .png()
    .toFile(resolve(out, `maskable-${size}.png`))
}
console.log('icons written to', out)
