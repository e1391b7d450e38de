import { createClient, type Client } from '@libsql/client'
import { eq, sql } from 'drizzle-orm'
import { afterEach, beforeEach, describe, expect, it } from 'vitest'
import { migrateDatabase, type Database } from '../../server/db/client'
import { databaseChangeMark } from '../../server/db/prepared-reads'
import { users } from '../../server/db/schema'
import { openTempDatabase, type TempDatabase } from '../support/temp-database'

// The app's client keeps its SELECT statements prepared on a connection of its own; these compare it
// with a plain @libsql/client on the same file, so rows, errors and freshness must read the same.
let temp: TempDatabase
let url: string
let db: Database
let plain: Client

beforeEach(async () => {
  temp = await openTempDatabase('reads')
  url = temp.url
  db = temp.db
  plain = createClient({ url })
  await db.run(sql`create table notes (id integer primary key, body text, data blob, done integer)`)
  await db.run(sql`insert into notes (body, data, done) values ('first', x'0102', 1), ('second', null, 0)`)
})

afterEach(() => {
  plain.close()
  temp.remove()
})

describe('prepared reads', () => {
  it('answers rows shaped like @libsql/client: names enumerable, indexes and repeated names by position', async () => {
    const query = { sql: 'select n.id, n.body, m.id, m.body as other, n.done from notes n join notes m on m.id != n.id order by n.id', args: [] }
    const ours = await db.$client.execute(query)
    const theirs = await plain.execute(query)
    expect(ours.columns).toEqual(theirs.columns)
    expect(ours.rows.map(row => Array.from(row))).toEqual(theirs.rows.map(row => Array.from(row)))
    expect(ours.rows.map(row => ({ ...row }))).toEqual(theirs.rows.map(row => ({ ...row })))
    expect(Object.keys(ours.rows[0]!)).toEqual(['id', 'body', 'other', 'done'])
    expect(JSON.stringify(ours.rows)).toBe(JSON.stringify(theirs.rows))
    expect(ours.rows[0]![2]).toBe(2)
  })

  it('reads blobs, bound arguments and named arguments as before', async () => {
    const blob = await db.$client.execute({ sql: 'select data from notes where body = ?', args: ['first'] })
    expect(new Uint8Array(blob.rows[0]!.data as ArrayBuffer).slice(0, 2)).toEqual(new Uint8Array([1, 2]))
    const named = await db.$client.execute({ sql: 'select body from notes where id = :id', args: { id: 2 } })
    expect(named.rows[0]!.body).toBe('second')
    const again = await db.$client.execute({ sql: 'select body from notes where id = :id', args: { id: 1 } })
    expect(again.rows[0]!.body).toBe('first')
  })

  it('sees every write committed elsewhere on the next read of the same statement', async () => {
    const count = () => db.$client.execute('select count(*) as n from notes').then(result => Number(result.rows[0]!.n))
    expect(await count()).toBe(2)
    await plain.execute('insert into notes (body) values (\'third\')')
    expect(await count()).toBe(3)
    await db.run(sql`delete from notes where body = 'first'`)
    expect(await count()).toBe(2)
    // A checkpoint finds no reader holding an old snapshot.
    const checkpoint = await plain.execute('pragma wal_checkpoint(TRUNCATE)')
    expect(Array.from(checkpoint.rows[0]!)[0]).toBe(0)
  })

  it('works under Drizzle selects', async () => {
    await migrateDatabase(db)
    await db.insert(users).values({ email: 'a@larchford.example', name: 'Ana', passwordHash: 'x' })
    const [found] = await db.select({ id: users.id, name: users.name, createdAt: users.createdAt }).from(users).where(eq(users.email, 'a@larchford.example'))
    expect(found!.name).toBe('Ana')
    expect(found!.createdAt).toBeInstanceOf(Date)
    const listed = await db.all<{ body: string }>(sql`select body from notes order by id`)
    expect(listed).toEqual([{ body: 'first' }, { body: 'second' }])
  })

  it('throws the same error as @libsql/client for a bad statement, and keeps working', async () => {
    const ours = await db.$client.execute('select nope from notes').catch((error: unknown) => error) as { code?: string, message?: string }
    const theirs = await plain.execute('select nope from notes').catch((error: unknown) => error) as { code?: string, message?: string }
    expect(ours.code).toBe(theirs.code)
    expect(ours.message).toBe(theirs.message)
    expect((await db.$client.execute('select count(*) as n from notes')).rows[0]!.n).toBe(2)
  })

  it('gives a change mark that moves with every commit, by this client or another, and only then', async () => {
    const first = databaseChangeMark(db.$client)
    expect(first).toBeDefined()
    await db.$client.execute('select count(*) from notes')
    expect(databaseChangeMark(db.$client)).toBe(first)
    await db.run(sql`update notes set body = 'edited' where id = 1`)
    const afterOwn = databaseChangeMark(db.$client)
    expect(afterOwn).not.toBe(first)
    await plain.execute('insert into notes (body) values (\'third\')')
    const afterOther = databaseChangeMark(db.$client)
    expect(afterOther).not.toBe(afterOwn)
    const transaction = await db.$client.transaction('write')
    await transaction.execute('delete from notes where id = 2')
    expect(databaseChangeMark(db.$client)).toBe(afterOther)
    await transaction.commit()
    expect(databaseChangeMark(db.$client)).not.toBe(afterOther)
  })

  it('has no change mark for a client it cannot tell about', () => {
    expect(databaseChangeMark(plain)).toBeUndefined()
  })
})
