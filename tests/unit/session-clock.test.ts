import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { SessionClock, type ClockChange, type ClockSegment } from '../../shared/utils/session-clock'

const now = () => performance.now()

beforeEach(() => {
  vi.useFakeTimers({ toFake: ['setTimeout', 'setInterval', 'performance', 'Date'] })
})
afterEach(() => {
  vi.useRealTimers()
})

const circuit: ClockSegment[] = [{ durationS: 30 }, { durationS: 15 }, { durationS: 0, manual: true }, { durationS: 20 }]

describe('SessionClock', () => {
  it('runs timed segments on their absolute schedule', () => {
    const clock = new SessionClock(circuit, now)
    expect(clock.state().status).toBe('ready')
    clock.start()
    vi.advanceTimersByTime(10_000)
    expect(clock.state()).toMatchObject({ status: 'running', index: 0, elapsedMs: 10_000, remainingMs: 20_000 })
    vi.advanceTimersByTime(25_000)
    const state = clock.state()
    expect(state.index).toBe(1)
    expect(state.elapsedMs).toBe(5_000)
    expect(state.remainingMs).toBe(10_000)
  })

  it('reports each change at its scheduled time, not when it was noticed', () => {
    const clock = new SessionClock([{ durationS: 2 }, { durationS: 3 }, { durationS: 4 }], now)
    const start = performance.now()
    clock.start()
    vi.advanceTimersByTime(7_400)
    const changes = clock.update()
    expect(changes.map(change => change.to)).toEqual([1, 2])
    expect(changes.map(change => change.scheduledAt - start)).toEqual([2_000, 5_000])
    expect(clock.state().elapsedMs).toBe(2_400)
  })

  it('waits on a manual segment until done', () => {
    const clock = new SessionClock(circuit, now)
    clock.start()
    vi.advanceTimersByTime(45_000)
    expect(clock.state()).toMatchObject({ index: 2, waiting: true, remainingMs: null })
    vi.advanceTimersByTime(600_000)
    expect(clock.state()).toMatchObject({ index: 2, waiting: true, elapsedMs: 600_000 })
    const [change] = clock.done()
    expect(change).toMatchObject({ from: 2, to: 3, reason: 'done', spentMs: 600_000 })
    vi.advanceTimersByTime(5_000)
    expect(clock.state()).toMatchObject({ index: 3, elapsedMs: 5_000, remainingMs: 15_000 })
  })

  it('freezes while paused and resumes exactly where it stopped', () => {
    const clock = new SessionClock(circuit, now)
    clock.start()
    vi.advanceTimersByTime(12_345)
    clock.pause()
    vi.advanceTimersByTime(3_600_000)
    expect(clock.state()).toMatchObject({ status: 'paused', index: 0, elapsedMs: 12_345, totalElapsedMs: 12_345 })
    clock.resume()
    expect(clock.state().elapsedMs).toBe(12_345)
    vi.advanceTimersByTime(17_655)
    expect(clock.state()).toMatchObject({ index: 1, elapsedMs: 0 })
    expect(clock.state().totalElapsedMs).toBe(30_000)
  })

  it('skips forward and goes back', () => {
    const clock = new SessionClock(circuit, now)
    clock.start()
    vi.advanceTimersByTime(4_000)
    expect(clock.skip()[0]).toMatchObject({ from: 0, to: 1, reason: 'skip', spentMs: 4_000 })
    vi.advanceTimersByTime(1_000)
    expect(clock.state()).toMatchObject({ index: 1, elapsedMs: 1_000 })
    expect(clock.back()[0]).toMatchObject({ from: 1, to: 0, reason: 'back' })
    expect(clock.state()).toMatchObject({ index: 0, elapsedMs: 0, remainingMs: 30_000 })
    clock.back()
    expect(clock.state().index).toBe(0)
    clock.skip()
    clock.skip()
    clock.skip()
    expect(clock.skip()[0]).toMatchObject({ from: 3, to: 4 })
    expect(clock.state()).toMatchObject({ status: 'finished', progress: 1 })
    clock.back()
    expect(clock.state()).toMatchObject({ status: 'running', index: 3, elapsedMs: 0 })
  })

  it('skips while paused and stays paused at the start of the next step', () => {
    const clock = new SessionClock(circuit, now)
    clock.start()
    vi.advanceTimersByTime(4_000)
    clock.pause()
    clock.skip()
    vi.advanceTimersByTime(60_000)
    expect(clock.state()).toMatchObject({ status: 'paused', index: 1, elapsedMs: 0 })
  })

  it('ends after the last segment and reports the whole session as done', () => {
    const clock = new SessionClock([{ durationS: 1 }, { durationS: 1 }], now)
    clock.start()
    vi.advanceTimersByTime(5_000)
    const changes = clock.update()
    expect(changes.at(-1)).toMatchObject({ from: 1, to: 2, reason: 'time' })
    expect(clock.state()).toMatchObject({ status: 'finished', progress: 1, totalElapsedMs: 2_000 })
  })

  it('restores a stored position, paused', () => {
    const clock = new SessionClock(circuit, now)
    clock.start()
    vi.advanceTimersByTime(37_000)
    const stored = JSON.parse(JSON.stringify(clock.snapshot()))
    vi.advanceTimersByTime(999_000)
    const again = SessionClock.restore(circuit, now, stored)
    expect(again.state()).toMatchObject({ status: 'paused', index: 1, elapsedMs: 7_000, totalElapsedMs: 37_000 })
    again.resume()
    vi.advanceTimersByTime(8_000)
    expect(again.state()).toMatchObject({ index: 2, waiting: true })
  })

  it('ends early on request', () => {
    const clock = new SessionClock(circuit, now)
    clock.start()
    vi.advanceTimersByTime(40_000)
    expect(clock.end()).toMatchObject([{ from: 0, to: 1, reason: 'time' }, { from: 1, to: 4, reason: 'skip', spentMs: 10_000 }])
    expect(clock.state()).toMatchObject({ status: 'finished', totalElapsedMs: 40_000 })
  })

  it('refuses negative or missing durations', () => {
    expect(() => new SessionClock([{ durationS: -1 }], now)).toThrow(/0 seconds or more/)
    expect(() => new SessionClock([{ durationS: Number.NaN }], now)).toThrow(/0 seconds or more/)
  })

  it('does not drift after 10,000 jittery ticks with pauses', () => {
    // Segments of 7 s and 3 s, like 40 rounds of work and recovery, driven by a ticker whose delays
    // jitter between 5 and 495 ms (a busy or throttled phone), with a pause now and then.
    const segments: ClockSegment[] = Array.from({ length: 1000 }, (_, i) => ({ durationS: i % 2 ? 3 : 7 }))
    const clock = new SessionClock(segments, now)
    let seed = 42
    const random = () => {
      seed = (seed * 1_103_515_245 + 12_345) % 2 ** 31
      return seed / 2 ** 31
    }
    const changes: ClockChange[] = []
    const start = performance.now()
    let pausedMs = 0
    clock.start()
    for (let tick = 0; tick < 10_000; tick++) {
      vi.advanceTimersByTime(5 + Math.floor(random() * 490))
      changes.push(...clock.update())
      if (tick % 1_000 === 500) {
        clock.pause()
        const pause = 1_000 + Math.floor(random() * 60_000)
        vi.advanceTimersByTime(pause)
        pausedMs += pause
        clock.resume()
      }
    }
    const active = performance.now() - start - pausedMs
    // Where the schedule says we must be after `active` ms of running time.
    const cycle = 10_000
    const expectedIndex = Math.floor(active / cycle) * 2 + (active % cycle >= 7_000 ? 1 : 0)
    const expectedElapsed = active % cycle >= 7_000 ? active % cycle - 7_000 : active % cycle
    const state = clock.state()
    expect(state.index).toBe(expectedIndex)
    expect(state.elapsedMs).toBe(expectedElapsed)
    expect(state.totalElapsedMs).toBe(active)
    // Every change was placed on the schedule: start of segment n + its duration, pauses included.
    for (const change of changes) expect(change.spentMs).toBe(segments[change.from]!.durationS * 1000)
    expect(changes).toHaveLength(expectedIndex)
  })
})
