import { describe, expect, it } from 'vitest'
import { SessionClock } from '../../shared/utils/session-clock'
import { plannedBeeps } from '../../shared/utils/session-beeps'

describe('the beeps planned from the clock', () => {
  it('counts down the last three seconds of each timed segment and beeps at each end, never at a segment\'s start', () => {
    let at = 1000
    const clock = new SessionClock([{ durationS: 10 }, { durationS: 2 }, { durationS: 30, manual: true }, { durationS: 5 }], () => at)
    clock.start()
    const beeps = plannedBeeps(clock.upcomingSegments(), { from: at, until: at + 60_000 })
    expect(beeps.map(beep => [beep.key, beep.kind, beep.at - 1000])).toEqual([
      ['0:3', 'countdown', 7000],
      ['0:2', 'countdown', 8000],
      ['0:1', 'countdown', 9000],
      ['0:0', 'change', 10_000],
      // A 2 s segment: its "3 s before the end" falls on its own start, where the change beep sounds.
      ['1:1', 'countdown', 11_000],
      ['1:0', 'change', 12_000],
      // The manual step stops the plan: nothing after it can be timed ahead.
    ])
    expect(beeps.every(beep => beep.boundaryAt >= beep.at)).toBe(true)
    at += 8500
    expect(plannedBeeps(clock.upcomingSegments(), { from: at, until: at + 2600 }).map(beep => beep.key)).toEqual(['0:1', '0:0', '1:1'])
  })

  it('plans nothing while paused and moves the whole plan by the pause on resume', () => {
    let at = 0
    const clock = new SessionClock([{ durationS: 10 }, { durationS: 10 }], () => at)
    clock.start()
    const before = plannedBeeps(clock.upcomingSegments(), { from: at, until: 60_000 })
    at = 4000
    clock.pause()
    expect(plannedBeeps(clock.upcomingSegments(), { from: at, until: 60_000 })).toEqual([])
    at = 6500
    clock.resume()
    const after = plannedBeeps(clock.upcomingSegments(), { from: at, until: 60_000 })
    expect(after.map(beep => beep.key)).toEqual(before.map(beep => beep.key))
    expect(after.map(beep => beep.at - 2500)).toEqual(before.map(beep => beep.at))
  })
})
