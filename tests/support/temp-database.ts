import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { openDatabase, type Database } from '../../server/db/client'

export interface TempDatabase {
  /** The `file:` URL, for a second client on the same file. */
  url: string
  /** The app's own client on it. */
  db: Database
  /** Closes the app's client and deletes the folder. */
  remove: () => void
}

/** A real SQLite file of its own in a fresh temporary folder, opened with the app's client (not migrated). */
export async function openTempDatabase(name: string, lockPatienceMs?: number): Promise<TempDatabase> {
  const dir = mkdtempSync(join(tmpdir(), `switchback-${name}-`))
  const url = `file:${join(dir, `${name}.db`)}`
  const db = await openDatabase(url, undefined, lockPatienceMs)
  return {
    url,
    db,
    remove: () => {
      db.$client.close()
      rmSync(dir, { recursive: true, force: true })
    },
  }
}
