import { createClient } from '@libsql/client'
import { sql } from 'drizzle-orm'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import type { Database } from '../../server/db/client'
import { databaseUnavailableMessage, sqliteCodeOf } from '../../server/utils/database-faults'
import { openTempDatabase, type TempDatabase } from '../support/temp-database'

// Real SQLite errors from a real file, not made-up error objects: the classifier must recognise what
// libSQL and Drizzle actually throw.
let temp: TempDatabase
let url: string
let db: Database

beforeEach(async () => {
  temp = await openTempDatabase('faults')
  url = temp.url
  db = temp.db
  await db.run(sql`create table notes (id integer primary key, body text unique)`)
})

afterEach(() => {
  temp.remove()
})

async function failureOf(work: () => Promise<unknown>) {
  try {
    await work()
  }
  catch (error) {
    return error
  }
  throw new Error('expected the statement to fail')
}

describe('database faults', () => {
  it('recognises a disk that is full (the page limit stands in for the disk)', async () => {
    await db.run(sql`pragma max_page_count = 3`)
    const error = await failureOf(() => db.run(sql`insert into notes (body) select hex(randomblob(2000)) from (select 1 union select 2 union select 3 union select 4)`))
    expect(sqliteCodeOf(error)).toMatch(/^SQLITE_FULL/)
    expect(databaseUnavailableMessage(error)).toMatch(/disk is full/)
  })

  it('recognises a database that cannot take writes', async () => {
    await db.run(sql`pragma query_only = 1`)
    const error = await failureOf(() => db.run(sql`insert into notes (body) values ('x')`))
    expect(sqliteCodeOf(error)).toMatch(/^SQLITE_READONLY/)
    expect(databaseUnavailableMessage(error)).toMatch(/read-only/)
  })

  it('leaves input mistakes alone: a broken constraint is not a fault of the server', async () => {
    await db.run(sql`insert into notes (body) values ('same')`)
    const error = await failureOf(() => db.run(sql`insert into notes (body) values ('same')`))
    expect(sqliteCodeOf(error)).toMatch(/^SQLITE_CONSTRAINT/)
    expect(databaseUnavailableMessage(error)).toBeUndefined()
  })

  it('recognises a lock held too long, and commits the next write once the lock is gone', async () => {
    const outsider = createClient({ url })
    const lock = await outsider.transaction('write')
    // The busy timeout is 5 s; the failure arrives after it.
    const error = await failureOf(() => db.run(sql`insert into notes (body) values ('during') returning id`))
    expect(sqliteCodeOf(error)).toMatch(/^SQLITE_BUSY/)
    expect(databaseUnavailableMessage(error)).toMatch(/busy/)
    await lock.rollback()
    outsider.close()

    await db.run(sql`insert into notes (body) values ('after')`)
    // Another connection sees the write: it was committed, not left in a leaked transaction.
    const reader = createClient({ url })
    const rows = (await reader.execute('select body from notes')).rows.map(row => row.body)
    reader.close()
    expect(rows).toEqual(['after'])
  }, 20_000)
})
