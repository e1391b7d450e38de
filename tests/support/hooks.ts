import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Client } from '@libsql/client'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll } from 'vitest'
import { makeDemoClip, type ClipOptions } from '../../seeds/clip'
import { launchBrowser } from './browser'
import { Fixtures } from './fixtures'
import { openTestDb } from './planner'
import { startStack, type Stack } from './stack'

// A test file's shared set-up, as hooks: each `use…` registers its beforeAll and afterAll in the file (or the
// describe block) that calls it and returns an object whose fields are filled in once beforeAll has run.
// Read the fields inside tests and hooks, never at the file's top level.

export interface RunningStack {
  stack: Stack
  /** The test database (a busy timeout, so it waits for the server's writes), opened on first use. */
  readonly db: Client
  /** Rows written straight into the test database, opened on first use. */
  readonly fixtures: Fixtures
}

export interface RunningBrowserStack extends RunningStack {
  browser: Browser
}

function useRunning(env: Record<string, string>, browserArgs?: string[]) {
  let db: Client | undefined
  let fixtures: Fixtures | undefined
  const running = {
    get db() {
      db ??= openTestDb(running.stack)
      return db
    },
    get fixtures() {
      fixtures ??= new Fixtures(running.stack)
      return fixtures
    },
  } as RunningBrowserStack
  beforeAll(async () => {
    running.stack = await startStack(env)
    if (browserArgs) running.browser = await launchBrowser(browserArgs)
  })
  afterAll(async () => {
    fixtures?.close()
    db?.close()
    await running.browser?.close()
    await running.stack?.stop()
  })
  return running
}

/** The built app with its own database, object store and mail catcher (see `startStack`), for this file's tests. */
export function useStack(env: Record<string, string> = {}): RunningStack {
  return useRunning(env)
}

/** `useStack` and Chromium; `browserArgs` adds switches for this file's browser only (a fake camera, say). */
export function useBrowserStack(options: { env?: Record<string, string>, browserArgs?: string[] } = {}): RunningBrowserStack {
  return useRunning(options.env ?? {}, options.browserArgs ?? [])
}

/** A generated demo clip written to a temporary file called `name`, removed after this file's tests. */
export function useDemoClipFile(name: string, options: ClipOptions): { path: string } {
  const clip = { path: '' }
  let folder: string | undefined
  beforeAll(async () => {
    folder = mkdtempSync(join(tmpdir(), 'switchback-clip-'))
    clip.path = join(folder, name)
    writeFileSync(clip.path, await makeDemoClip(options))
  })
  afterAll(() => {
    if (folder) rmSync(folder, { recursive: true, force: true })
  })
  return clip
}
