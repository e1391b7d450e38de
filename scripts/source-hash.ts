// A fingerprint of everything that goes into `nuxt build`: written into .output at build time and
// compared before the integration and browser tests, so they never run against a stale server.
import { createHash } from 'node:crypto'
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'

const inputs = [
  'app.vue', 'nuxt.config.ts', 'tailwind.config.ts', 'package-lock.json',
  'assets', 'components', 'composables', 'layouts', 'middleware', 'pages', 'plugins', 'public', 'server', 'shared', 'stores',
]

function files(root: string, path: string): string[] {
  const full = join(root, path)
  if (!existsSync(full)) return []
  if (!statSync(full).isDirectory()) return [path]
  return readdirSync(full).sort().flatMap(name => files(root, join(path, name)))
}

export function sourceHash(root: string) {
  const hash = createHash('sha256')
  for (const file of inputs.flatMap(input => files(root, input))) {
    hash.update(relative(root, join(root, file)).replaceAll('\\', '/'))
    hash.update('\0')
    hash.update(readFileSync(join(root, file)))
    hash.update('\0')
  }
  return hash.digest('hex')
}

export const buildStampFile = '.output/build-stamp.json'
