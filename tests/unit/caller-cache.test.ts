import { afterEach, describe, expect, it, vi } from 'vitest'
import { CALLER_CACHE_MS, cachedCaller, cachedCallerCount, callerGeneration, forgetCallers, rememberCaller } from '../../server/utils/caller-cache'
import type { Caller } from '../../server/utils/auth'

function caller(userId: number, teamId: number): Caller {
  return { userId, teamId, role: 'athlete', name: `Person ${userId}`, email: `p${userId}@larchford.example`, timezone: 'UTC', teamName: 'Larchford Ridge Runners' }
}

const later = () => Date.now() + 3600_000

describe('the in-process cache of callers', () => {
  afterEach(() => {
    forgetCallers({})
    vi.useRealTimers()
  })

  it('answers a remembered cookie and forgets a revoked sign-in at once', () => {
    rememberCaller('cookie-a', caller(1, 10), 'hash-a', later(), callerGeneration())
    rememberCaller('cookie-b', caller(2, 10), 'hash-b', later(), callerGeneration())
    expect(cachedCaller('cookie-a')?.caller.userId).toBe(1)
    forgetCallers({ tokenHashes: ['hash-a'] })
    expect(cachedCaller('cookie-a')).toBeUndefined()
    expect(cachedCaller('cookie-b')?.caller.userId).toBe(2)
  })

  it('forgets by person, by team, and by person in one team', () => {
    rememberCaller('a', caller(1, 10), 'h1', later(), callerGeneration())
    rememberCaller('b', caller(1, 11), 'h2', later(), callerGeneration())
    rememberCaller('c', caller(2, 10), 'h3', later(), callerGeneration())
    forgetCallers({ userId: 1, teamId: 11 })
    expect([cachedCaller('a'), cachedCaller('b'), cachedCaller('c')].map(hit => Boolean(hit))).toEqual([true, false, true])
    forgetCallers({ teamId: 10 })
    expect(cachedCallerCount()).toBe(0)
    rememberCaller('d', caller(3, 12), 'h4', later(), callerGeneration())
    forgetCallers({ userId: 3 })
    expect(cachedCaller('d')).toBeUndefined()
  })

  it('does not remember a lookup that started before a sign-in was revoked', () => {
    const lookedUpAt = callerGeneration()
    forgetCallers({ tokenHashes: ['hash-a'] })
    rememberCaller('cookie-a', caller(1, 10), 'hash-a', later(), lookedUpAt)
    expect(cachedCaller('cookie-a')).toBeUndefined()
  })

  it('keeps an entry no longer than its time to live or its sign-in', () => {
    vi.useFakeTimers()
    rememberCaller('long', caller(1, 10), 'h1', later(), callerGeneration())
    rememberCaller('ending', caller(2, 10), 'h2', Date.now() + 1000, callerGeneration())
    vi.advanceTimersByTime(1000)
    expect(cachedCaller('ending')).toBeUndefined()
    expect(cachedCaller('long')).toBeDefined()
    vi.advanceTimersByTime(CALLER_CACHE_MS)
    expect(cachedCaller('long')).toBeUndefined()
  })

  it('holds a bounded number of entries, dropping the least recently used', () => {
    for (let index = 0; index < 2001; index++) rememberCaller(`c${index}`, caller(index, 1), `h${index}`, later(), callerGeneration())
    expect(cachedCallerCount()).toBe(2000)
    expect(cachedCaller('c0')).toBeUndefined()
    expect(cachedCaller('c2000')).toBeDefined()
  })
})
