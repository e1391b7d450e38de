import type { SQL } from 'drizzle-orm'
import { entryLogs } from '../db/schema'
import type { EntryRow } from './sessions'

/** An entry to insert; the exercise link may be a subquery (it stays empty when the exercise is gone). */
type EntryValues = Omit<typeof entryLogs.$inferInsert, 'exerciseId'> & { exerciseId?: number | null | SQL }

interface Waiting {
  values: EntryValues
  resolve: (row: EntryRow | undefined) => void
  reject: (error: unknown) => void
}

/** At most this many entries go into one statement. */
const MOST_PER_COMMIT = 200

let waiting: Waiting[] = []
let scheduled = false

const keyOf = (sessionId: number, idempotencyKey: string) => `${sessionId}\n${idempotencyKey}`

/**
 * Inserts one entry, sharing its commit with the entries other athletes are posting at the same moment
 * (group commit). Each commit waits for the disk (a full sync in WAL mode, a few milliseconds here), so one
 * commit per entry caps a busy squad at a few hundred writes a second; one commit for every entry that
 * arrived meanwhile keeps the same durability (nothing is answered before its commit is on disk) at many
 * times the rate. Resolves with the stored row, or undefined when an entry with the same session and
 * idempotency key was already there.
 */
export function insertEntry(values: EntryValues): Promise<EntryRow | undefined> {
  return new Promise((resolve, reject) => {
    waiting.push({ values, resolve, reject })
    if (!scheduled) {
      scheduled = true
      // After this turn's other requests have reached this point too.
      setImmediate(() => void commitWaiting())
    }
  })
}

async function commitWaiting() {
  try {
    const db = await useDb()
    while (waiting.length) {
      const batch = waiting.slice(0, MOST_PER_COMMIT)
      waiting = waiting.slice(MOST_PER_COMMIT)
      try {
        const rows = await db.insert(entryLogs).values(batch.map(item => item.values)).onConflictDoNothing().returning()
        const stored = new Map(rows.map(row => [keyOf(row.sessionId, row.idempotencyKey), row]))
        for (const item of batch) {
          // The same key twice in one commit: the first is the stored one, the second a repeat.
          const key = keyOf(item.values.sessionId, item.values.idempotencyKey)
          item.resolve(stored.get(key))
          stored.delete(key)
        }
      }
      catch (error) {
        if (batch.length === 1) {
          batch[0]!.reject(error)
          continue
        }
        // One entry's failure must not fail the others: each goes again on its own.
        for (const item of batch) {
          try {
            const [row] = await db.insert(entryLogs).values(item.values).onConflictDoNothing().returning()
            item.resolve(row)
          }
          catch (single) {
            item.reject(single)
          }
        }
      }
    }
  }
  catch (error) {
    // No database at all: everyone waiting hears it.
    for (const item of waiting.splice(0)) item.reject(error)
  }
  finally {
    scheduled = false
  }
}
