import { spawnSync } from 'node:child_process'
import { existsSync, readFileSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { buildStampFile, sourceHash } from '../../scripts/source-hash'

const root = resolve(import.meta.dirname, '../..')

function builtHash(): string | null {
  const file = join(root, buildStampFile)
  if (!existsSync(file)) return null
  return (JSON.parse(readFileSync(file, 'utf8')) as { sourceHash?: string }).sourceHash ?? null
}

/**
 * The integration and browser tests run the built server (.output). Before they start, the build's
 * source fingerprint must match the sources: otherwise rebuild (visibly), or with
 * SWITCHBACK_NO_REBUILD=1 stop with a message saying what to run.
 */
export default function ensureFreshBuild() {
  const current = sourceHash(root)
  const built = builtHash()
  if (built === current) return
  const why = built ? 'the sources changed since the last `npm run build`' : 'there is no build yet (.output/build-stamp.json is missing)'
  if (process.env.SWITCHBACK_NO_REBUILD) {
    throw new Error(`The built server is stale: ${why}. Run \`npm run build\` and try again.`)
  }
  console.log(`\n[fresh-build] ${why}; running \`npm run build\` first…\n`)
  const result = spawnSync('npm', ['run', 'build'], { cwd: root, stdio: 'inherit' })
  if (result.status !== 0) throw new Error('`npm run build` failed, so the integration and browser tests cannot run.')
  if (builtHash() !== sourceHash(root)) throw new Error('The build finished but its source fingerprint still differs; did a file change during the build?')
}
