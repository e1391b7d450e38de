import { afterEach, describe, expect, it, vi } from 'vitest'
import { ExpiringCache } from '../../server/utils/expiring-cache'

const later = () => Date.now() + 60_000

describe('the expiring cache shared by callers, sessions and kept answers', () => {
  afterEach(() => {
    vi.useRealTimers()
  })

  it('lets the least recently used go first when the weight budget is spent, and keeps nothing heavier than it', () => {
    const cache = new ExpiringCache<string>(10, text => text.length)
    cache.set('a', 'aaaa', later())
    cache.set('b', 'bbbb', later())
    expect(cache.get('a')).toBe('aaaa')
    cache.set('c', 'cccc', later())
    expect([cache.get('a'), cache.get('b'), cache.get('c')]).toEqual(['aaaa', undefined, 'cccc'])
    cache.set('huge', 'x'.repeat(11), later())
    expect(cache.get('huge')).toBeUndefined()
    expect(cache.size).toBe(2)
    // Replacing an entry frees its old weight first.
    cache.set('a', 'aaaaaa', later())
    expect([cache.get('a'), cache.get('c')]).toEqual(['aaaaaa', 'cccc'])
  })

  it('forgets an entry at its own time, and by what it holds', () => {
    vi.useFakeTimers()
    const cache = new ExpiringCache<number>(100)
    cache.set('soon', 1, Date.now() + 1000)
    cache.set('late', 2, Date.now() + 5000)
    cache.set('odd', 3, Date.now() + 5000)
    vi.advanceTimersByTime(1000)
    expect(cache.get('soon')).toBeUndefined()
    cache.deleteWhere(value => value % 2 === 1)
    expect([cache.get('late'), cache.get('odd')]).toEqual([2, undefined])
    expect(cache.size).toBe(1)
  })
})
