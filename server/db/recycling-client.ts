import { setTimeout as pause } from 'node:timers/promises'
import type { Client, Transaction } from '@libsql/client'

const lockCodes = /^SQLITE_(BUSY|LOCKED)/

/** Whether a statement failed because another connection held the lock past the busy timeout. */
export function isLockError(error: unknown) {
  const code = (error as { code?: unknown })?.code
  return typeof code === 'string' && lockCodes.test(code)
}

interface Generation {
  client: Client
  openTransactions: number
  retired: boolean
}

/**
 * A local libSQL client that replaces itself after a lock error, and waits for a lock without holding up
 * the process.
 *
 * When a write gives up on a lock (SQLITE_BUSY after the busy timeout), libSQL 0.5 leaves the failed
 * statement un-reset on its connection: that connection keeps the write lock, and every later write
 * through it is silently left uncommitted. Closing the client is the only public way to release it, so
 * after such an error new work goes to a fresh client and the old one is closed once its open
 * transactions (which hold their own connections) have ended.
 *
 * libSQL waits for a lock inside the native call, so a long busy timeout stops every other request of the
 * process for as long (a write waiting 5 s on another process's lock froze reads for 5 s). The clients
 * `open` makes should therefore have a short busy timeout: a statement, batch or transaction start
 * (`BEGIN IMMEDIATE`, which takes the write lock) that meets a lock is tried again on a fresh client after a
 * pause on the event loop, until `patienceMs` have passed; then the lock error is thrown. Trying again is
 * safe because each of those is atomic: one that failed on a lock wrote nothing (`migrate` runs its batch in
 * one transaction too). `executeMultiple` is not atomic, and is tried once.
 */
export function recyclingClient(open: () => Client, patienceMs = 0): Client {
  let current: Generation = { client: open(), openTransactions: 0, retired: false }

  const closeIfIdle = (generation: Generation) => {
    if (generation.retired && generation.openTransactions === 0 && !generation.client.closed) generation.client.close()
  }
  const retire = (generation: Generation) => {
    if (generation.retired) return
    generation.retired = true
    if (generation === current) current = { client: open(), openTransactions: 0, retired: false }
    closeIfIdle(generation)
  }
  const guarded = async <T>(generation: Generation, work: () => Promise<T>): Promise<T> => {
    try {
      return await work()
    }
    catch (error) {
      if (isLockError(error)) retire(generation)
      throw error
    }
  }
  const patiently = async <T>(work: (generation: Generation) => Promise<T>): Promise<T> => {
    const giveUpAt = Date.now() + patienceMs
    for (let attempt = 0; ; attempt += 1) {
      const generation = current
      try {
        return await guarded(generation, () => work(generation))
      }
      catch (error) {
        const left = giveUpAt - Date.now()
        if (!isLockError(error) || left <= 0) throw error
        // 5, 10, 20 … up to 100 ms, jittered so that waiting processes do not retry in step.
        await pause(Math.min(left, Math.min(100, 5 * 2 ** attempt) * (0.5 + Math.random() / 2)))
      }
    }
  }

  const wrapTransaction = (generation: Generation, transaction: Transaction): Transaction => {
    let ended = false
    const end = () => {
      if (ended) return
      ended = true
      generation.openTransactions -= 1
      closeIfIdle(generation)
    }
    return new Proxy(transaction, {
      get(target, property, receiver) {
        const value = Reflect.get(target, property, receiver)
        if (typeof value !== 'function') return value
        if (property === 'commit' || property === 'rollback') {
          return async (...args: unknown[]) => {
            try {
              return await (value as (...a: unknown[]) => Promise<unknown>).apply(target, args)
            }
            finally {
              if (target.closed) end()
            }
          }
        }
        if (property === 'close') {
          return (...args: unknown[]) => {
            (value as (...a: unknown[]) => unknown).apply(target, args)
            end()
          }
        }
        return value.bind(target)
      },
    })
  }

  return new Proxy({} as Client, {
    get(_target, property) {
      const generation = current
      const value = Reflect.get(generation.client, property)
      if (typeof value !== 'function') return value
      if (property === 'transaction') {
        return (...args: unknown[]) => patiently(async (generation) => {
          const transaction = await generation.client.transaction(...args as Parameters<Client['transaction']>)
          generation.openTransactions += 1
          return wrapTransaction(generation, transaction)
        })
      }
      if (property === 'execute' || property === 'batch' || property === 'migrate') {
        return (...args: unknown[]) => patiently(generation => (Reflect.get(generation.client, property) as (...a: unknown[]) => Promise<unknown>).apply(generation.client, args))
      }
      if (property === 'executeMultiple') {
        return (...args: unknown[]) => guarded(generation, () => (value as (...a: unknown[]) => Promise<unknown>).apply(generation.client, args))
      }
      if (property === 'close') {
        return () => {
          current.retired = true
          current.client.close()
        }
      }
      return value.bind(generation.client)
    },
  })
}
