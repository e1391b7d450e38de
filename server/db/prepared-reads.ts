import Database from 'libsql'
import { LibsqlError, type Client, type InStatement, type InValue, type ResultSet, type Row } from '@libsql/client'
import { isLockError } from './recycling-client'

type Connection = Database.Database
type Statement = Database.Statement

interface Prepared {
  statement: Statement
  columns: string[]
  /** Builds one row: named fields enumerable, indexes and `length` on the prototype, as libSQL's rows read. */
  makeRow: (values: unknown[]) => Row
}

/** Distinct read statements kept prepared; the app has a few hundred, so this only bounds a runaway. */
const MAX_STATEMENTS = 1000
// Read-only statements: SELECT, or WITH … SELECT. Anything naming a write keyword goes to the plain client
// (a column called `update` only loses the cache, never its correctness).
const readOnly = (sql: string) => /^\s*(?:select|with)\b/i.test(sql) && !/\b(?:insert|update|delete|replace)\b/i.test(sql)

/**
 * A local libSQL client whose reads (SELECT, WITH … SELECT) run on one extra connection of their own, each
 * prepared once and kept for that connection's life. `@libsql/client` prepares every statement anew, which was
 * the heaviest single item of the JSON routes (docs/performance.md); its rows also defined every field
 * one by one. Everything else (writes, pragmas, batches, transactions, migrations) goes to `client`
 * unchanged.
 *
 * Safe to keep because each SELECT runs to its end in one synchronous call, so it holds no snapshot
 * afterwards: the next one sees every write committed meanwhile, by any connection or process. A
 * statement that failed is never reused, and a lock error closes the connection with all its
 * statements (libSQL can leave a failed statement un-reset, holding its lock: see recycling-client.ts).
 */
export function withPreparedReads(client: Client, path: string, timeout: number): Client {
  let connection: Connection | undefined
  let connectionNumber = 0
  let prepared = new Map<string, Prepared>()
  let dataVersion: Statement | undefined

  const drop = () => {
    const open = connection
    connection = undefined
    prepared = new Map()
    dataVersion = undefined
    if (open?.open) open.close()
  }

  const connect = () => {
    if (!connection) {
      connection = new Database(path, { timeout })
      connectionNumber = ++openedConnections
    }
    return connection
  }

  const prepare = (sql: string) => {
    const connection = connect()
    const statement = connection.prepare(sql)
    statement.safeIntegers(true)
    statement.raw(true)
    const columns = statement.columns().map(column => column.name)
    const entry: Prepared = { statement, columns, makeRow: rowMaker(columns) }
    if (prepared.size >= MAX_STATEMENTS) prepared.delete(prepared.keys().next().value!)
    prepared.set(sql, entry)
    return entry
  }

  const read = (sql: string, args: InValue[] | Record<string, InValue>): ResultSet => {
    try {
      const entry = prepared.get(sql) ?? prepare(sql)
      const rows = (entry.statement.all(toSqlArgs(args)) as unknown[][]).map(entry.makeRow)
      return resultSet(entry.columns, rows)
    }
    catch (error) {
      prepared.delete(sql)
      const mapped = toLibsqlError(error)
      if (isLockError(mapped)) drop()
      throw mapped
    }
  }

  const execute = async (statementOrSql: InStatement | string, args?: InValue[]) => {
    const sql = typeof statementOrSql === 'string' ? statementOrSql : statementOrSql.sql
    if (client.closed || (!prepared.has(sql) && !readOnly(sql))) return client.execute(statementOrSql as InStatement)
    return read(sql, typeof statementOrSql === 'string' ? args ?? [] : statementOrSql.args ?? [])
  }

  // SQLite's data_version moves whenever another connection (every write goes through `client`, or another
  // process) has committed since; its values compare only within one connection, hence the number.
  const changeMark = (): string | undefined => {
    try {
      const connection = connect()
      dataVersion ??= connection.prepare('PRAGMA data_version').raw(true)
      const [version] = dataVersion.get() as [number]
      return `${connectionNumber}:${version}`
    }
    catch {
      drop()
      return undefined
    }
  }

  return new Proxy(client, {
    get(target, property) {
      if (property === 'execute') return execute
      if (property === changeMarkKey) return changeMark
      if (property === 'close') {
        return () => {
          drop()
          target.close()
        }
      }
      const value = Reflect.get(target, property)
      return typeof value === 'function' ? value.bind(target) : value
    },
  })
}

let openedConnections = 0
const changeMarkKey = Symbol('changeMark')

/**
 * A mark that changes whenever anything has been committed to the database file since it was last read,
 * by this process or any other; `undefined` when the client cannot tell (not a local file, or the
 * database cannot be read). Two equal marks mean nothing was written in between.
 */
export function databaseChangeMark(client: Client): string | undefined {
  const read = (client as unknown as Record<symbol, unknown>)[changeMarkKey]
  return typeof read === 'function' ? (read as () => string | undefined)() : undefined
}

/** Arguments as the native binding takes them: booleans and dates as numbers, blobs as Buffers. */
function toSqlArgs(args: InValue[] | Record<string, InValue>) {
  if (Array.isArray(args)) return args.map(toSqlValue)
  const named: Record<string, unknown> = {}
  for (const name in args) named[/^[@$:]/.test(name) ? name.slice(1) : name] = toSqlValue(args[name]!)
  return named
}

function toSqlValue(value: InValue) {
  if (typeof value === 'number' && !Number.isFinite(value)) throw new RangeError('Only finite numbers (not Infinity or NaN) can be passed as arguments')
  if (typeof value === 'boolean') return value ? 1 : 0
  if (value instanceof ArrayBuffer) return Buffer.from(value)
  if (value instanceof Date) return value.valueOf()
  if (value === undefined) throw new TypeError('undefined cannot be passed as argument to the database')
  return value
}

function fromSqlValue(value: unknown) {
  if (typeof value === 'bigint') {
    if (value < Number.MIN_SAFE_INTEGER || value > Number.MAX_SAFE_INTEGER) throw new RangeError('Received integer which cannot be safely represented as a JavaScript number')
    return Number(value)
  }
  // As @libsql/client answers blobs: the Buffer's ArrayBuffer.
  if (value instanceof Buffer) return value.buffer
  return value
}

// A row's values by position, under a non-enumerable symbol: not in Object.keys, JSON, for…in or a spread copy.
const positional = Symbol('values')

/**
 * Rows read like @libsql/client's: fields by name (enumerable, the first of a repeated name wins) and by
 * index with a `length` (not enumerable, so spreading or serialising a row shows only the names). The
 * indexes live on a prototype shared by every row of the statement instead of being defined per row.
 */
function rowMaker(columns: string[]) {
  const prototype = {}
  Object.defineProperty(prototype, 'length', { value: columns.length })
  columns.forEach((_, index) => {
    Object.defineProperty(prototype, index, { get(this: { [positional]: unknown[] }) {
      return this[positional][index]
    } })
  })
  const named = columns.map((name, index) => ({ name, index }))
    .filter(({ name, index }) => name !== 'length' && !(/^\d+$/.test(name) && Number(name) < columns.length) && columns.indexOf(name) === index)
  return (values: unknown[]) => {
    for (let index = 0; index < values.length; index++) values[index] = fromSqlValue(values[index])
    const row = Object.create(prototype) as Record<string | symbol, unknown>
    Object.defineProperty(row, positional, { value: values })
    for (const { name, index } of named) row[name] = values[index]
    return row as unknown as Row
  }
}

function resultSet(columns: string[], rows: Row[]): ResultSet {
  return {
    columns,
    columnTypes: columns.map(() => ''),
    rows,
    rowsAffected: 0,
    lastInsertRowid: undefined,
    toJSON: () => ({ columns, columnTypes: columns.map(() => ''), rows: rows.map(row => Array.from(row as unknown as ArrayLike<unknown>)), rowsAffected: 0, lastInsertRowid: null }),
  }
}

/** The same error @libsql/client throws for a failed statement: base code, extended code, raw code. */
function toLibsqlError(error: unknown) {
  if (error instanceof Database.SqliteError) {
    const raw = (error as { rawCode?: number }).rawCode
    const base = raw === undefined ? 'SQLITE_UNKNOWN' : baseCodes[raw & 0xFF] ?? `SQLITE_UNKNOWN_${raw & 0xFF}`
    return new LibsqlError(error.message, base, error.code, raw, error)
  }
  return error
}

const baseCodes: Record<number, string> = {
  1: 'SQLITE_ERROR', 2: 'SQLITE_INTERNAL', 3: 'SQLITE_PERM', 4: 'SQLITE_ABORT', 5: 'SQLITE_BUSY', 6: 'SQLITE_LOCKED',
  7: 'SQLITE_NOMEM', 8: 'SQLITE_READONLY', 9: 'SQLITE_INTERRUPT', 10: 'SQLITE_IOERR', 11: 'SQLITE_CORRUPT',
  12: 'SQLITE_NOTFOUND', 13: 'SQLITE_FULL', 14: 'SQLITE_CANTOPEN', 15: 'SQLITE_PROTOCOL', 16: 'SQLITE_EMPTY',
  17: 'SQLITE_SCHEMA', 18: 'SQLITE_TOOBIG', 19: 'SQLITE_CONSTRAINT', 20: 'SQLITE_MISMATCH', 21: 'SQLITE_MISUSE',
  22: 'SQLITE_NOLFS', 23: 'SQLITE_AUTH', 24: 'SQLITE_FORMAT', 25: 'SQLITE_RANGE', 26: 'SQLITE_NOTADB',
  27: 'SQLITE_NOTICE', 28: 'SQLITE_WARNING',
}
