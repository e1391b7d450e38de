import { createClient, type Client } from '@libsql/client'
import { sql } from 'drizzle-orm'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import type { Database } from '../../server/db/client'
import { openTempDatabase, type TempDatabase } from '../support/temp-database'

// Another process (a script, another replica) holding the write lock: the app's client waits for it in
// short tries with pauses on the event loop, so the rest of the process keeps answering meanwhile.
let temp: TempDatabase
let db: Database
let outsider: Client

async function openWithPatience(patienceMs: number) {
  temp = await openTempDatabase('locks', patienceMs)
  db = temp.db
  outsider = createClient({ url: temp.url })
  await db.run(sql`create table sets (id integer primary key, label text not null unique)`)
}

/** Counts the event loop's turns: a wait inside a native call lets none through. */
function countTurns() {
  let turns = 0
  const timer = setInterval(() => (turns += 1), 10)
  return { stop: () => (clearInterval(timer), turns) }
}

const labels = async () => (await outsider.execute('select label from sets order by id')).rows.map(row => row.label)

beforeEach(() => {
  temp = undefined as unknown as TempDatabase
})

afterEach(() => {
  outsider?.close()
  temp?.remove()
})

describe('waiting for another connection\'s write lock', () => {
  it('keeps the event loop turning while a write waits, then stores it once the lock is free', async () => {
    await openWithPatience(5000)
    const lock = await outsider.transaction('write')
    const turns = countTurns()
    setTimeout(() => void lock.rollback(), 400)
    await db.$client.execute({ sql: 'insert into sets (label) values (?)', args: ['hill rep 1'] })
    // 400 ms at one turn per 10 ms: a wait that held the process would have let none through.
    expect(turns.stop()).toBeGreaterThan(10)
    expect(await labels()).toEqual(['hill rep 1'])
  })

  it('waits the same way to begin a transaction', async () => {
    await openWithPatience(5000)
    const lock = await outsider.transaction('write')
    const turns = countTurns()
    setTimeout(() => void lock.rollback(), 400)
    await db.transaction(async (tx) => {
      await tx.run(sql`insert into sets (label) values ('stride 1')`)
      await tx.run(sql`insert into sets (label) values ('stride 2')`)
    })
    expect(turns.stop()).toBeGreaterThan(10)
    expect(await labels()).toEqual(['stride 1', 'stride 2'])
  })

  it('waits the same way to apply migrations', async () => {
    await openWithPatience(5000)
    const lock = await outsider.transaction('write')
    const turns = countTurns()
    setTimeout(() => void lock.rollback(), 400)
    await db.$client.migrate([
      { sql: 'insert into sets (label) values (?)', args: ['drill 1'] },
      { sql: 'insert into sets (label) values (?)', args: ['drill 2'] },
    ])
    expect(turns.stop()).toBeGreaterThan(10)
    expect(await labels()).toEqual(['drill 1', 'drill 2'])
  })

  it('gives up with the lock error after its patience, writes nothing, and the next write goes through', async () => {
    await openWithPatience(300)
    const lock = await outsider.transaction('write')
    await expect(db.$client.batch([
      { sql: 'insert into sets (label) values (?)', args: ['set 1'] },
      { sql: 'insert into sets (label) values (?)', args: ['set 2'] },
    ], 'write')).rejects.toMatchObject({ code: expect.stringMatching(/^SQLITE_BUSY/) })
    await lock.rollback()
    expect(await labels()).toEqual([])
    await db.$client.execute({ sql: 'insert into sets (label) values (?)', args: ['set 1'] })
    expect(await labels()).toEqual(['set 1'])
  })

  it('does not try a failed write again when the failure was not a lock', async () => {
    await openWithPatience(5000)
    await db.$client.execute({ sql: 'insert into sets (label) values (?)', args: ['tempo'] })
    await expect(db.$client.execute({ sql: 'insert into sets (label) values (?)', args: ['tempo'] }))
      .rejects.toMatchObject({ code: expect.stringMatching(/^SQLITE_CONSTRAINT/) })
    expect(await labels()).toEqual(['tempo'])
  })
})
