/**
 * SQLite answers these when it cannot take a write just now: another writer holds the lock past the
 * busy timeout, the file or folder is read-only, or the disk is full. None is the caller's fault, and
 * none left a partial row (each write is one statement or one transaction), so the answer is a 503.
 */
const unavailableCodes: Record<string, string> = {
  SQLITE_BUSY: 'The database is busy with other writes; nothing was saved. Try again in a moment.',
  SQLITE_LOCKED: 'The database is busy with other writes; nothing was saved. Try again in a moment.',
  SQLITE_READONLY: 'The database cannot take changes right now (it is read-only); nothing was saved. Reading still works.',
  SQLITE_FULL: 'The server\'s disk is full; nothing was saved. Reading still works. The team\'s administrator has to free space.',
  SQLITE_IOERR: 'The database could not write to its disk; nothing was saved. Try again in a moment.',
  SQLITE_CANTOPEN: 'The database file cannot be opened right now; try again in a moment.',
}

/** The first SQLite result code found along an error's `cause` chain (H3 → Drizzle → libSQL). */
export function sqliteCodeOf(error: unknown): string | undefined {
  let current = error as { code?: unknown, cause?: unknown, message?: unknown } | undefined
  for (let depth = 0; current && depth < 6; depth += 1) {
    if (typeof current.code === 'string' && current.code.startsWith('SQLITE_')) return current.code
    current = current.cause as typeof current
  }
  return undefined
}

/** A clear message when `error` means the database cannot take a write just now; undefined otherwise. */
export function databaseUnavailableMessage(error: unknown): string | undefined {
  const code = sqliteCodeOf(error)
  if (!code) return undefined
  // Extended codes (SQLITE_BUSY_SNAPSHOT, SQLITE_READONLY_DBMOVED, SQLITE_IOERR_WRITE, …) share their family's answer.
  const family = Object.keys(unavailableCodes).find(name => code === name || code.startsWith(`${name}_`))
  return family ? unavailableCodes[family] : undefined
}
