import { spawnSync } from 'node:child_process'
import { accessSync, constants } from 'node:fs'

const candidates = () => [process.env.CHROME_PATH, process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser']

function findChromium(): string | undefined {
  for (const path of candidates()) {
    if (!path) continue
    try {
      accessSync(path, constants.X_OK)
      return path
    }
    catch { /* try the next one */ }
  }
  return undefined
}

function run(command: string, args: string[]) {
  console.log(`[chromium] $ ${command} ${args.join(' ')}`)
  const result = spawnSync(command, args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } })
  return result.status === 0
}

/**
 * The browser tests drive Debian's Chromium through playwright-core (no browser download). Find it;
 * where it is missing and this is root on an apt system, install it with the usual progress output;
 * otherwise stop at once saying what to install. The path found is handed to the tests as CHROMIUM_PATH.
 */
export default function ensureChromium() {
  let found = findChromium()
  if (!found) {
    const isRoot = process.getuid?.() === 0
    const hasApt = spawnSync('sh', ['-c', 'command -v apt-get'], { stdio: 'ignore' }).status === 0
    if (!isRoot || !hasApt) {
      throw new Error('The browser tests need Chromium, and none was found (CHROME_PATH, /usr/bin/chromium, /usr/bin/chromium-browser). '
        + 'Install it (on Debian/Ubuntu: `sudo apt-get install -y chromium`) or set CHROME_PATH to a Chromium binary, then run the tests again.')
    }
    console.log('[chromium] Chromium is missing; installing Debian\'s package (about a minute)…')
    if (!run('apt-get', ['update']) || !run('apt-get', ['install', '-y', 'chromium'])) {
      throw new Error('Installing Chromium with apt-get failed; see the output above.')
    }
    found = findChromium()
    if (!found) throw new Error('apt-get installed chromium, but no binary appeared at /usr/bin/chromium.')
  }
  process.env.CHROMIUM_PATH = found
}
