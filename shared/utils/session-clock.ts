// The session player's clock. Framework-free: pages drive it with `now()` (performance.now in the
// browser) and read its state. Every segment's end is an absolute timestamp; nothing counts ticks.

export interface ClockSegment {
  durationS: number
  /** Waits for `done()` instead of ending on time (rep and distance steps). */
  manual?: boolean
}

export type ClockStatus = 'ready' | 'running' | 'paused' | 'finished'

export interface ClockChange {
  from: number
  /** The next segment's index; `segments.length` when the session has ended. */
  to: number
  /** When the change was due on the clock's time line (ms); for a manual step, when done was pressed. */
  scheduledAt: number
  /** How the segment ended. */
  reason: 'time' | 'done' | 'skip' | 'back'
  /** Active time spent in the segment that ended, in ms. */
  spentMs: number
}

export interface ClockState {
  status: ClockStatus
  index: number
  /** Active time in the current segment (ms), frozen while paused. */
  elapsedMs: number
  /** Time left in a timed segment (ms); null for a manual one. */
  remainingMs: number | null
  /** True when a manual segment is waiting for done. */
  waiting: boolean
  /** Active time since the start, pauses excluded (ms). */
  totalElapsedMs: number
  /** Share of the session's planned time behind us, 0 to 1. */
  progress: number
}

export interface ClockSnapshot {
  status: ClockStatus
  index: number
  elapsedMs: number
  totalElapsedMs: number
}

export class SessionClock {
  readonly segments: readonly ClockSegment[]
  private readonly now: () => number
  private status: ClockStatus = 'ready'
  private index = 0
  /** Absolute time the current segment started, shifted by pauses. */
  private segmentStart = 0
  /** Active time in segments already left behind. */
  private doneMs = 0
  private pausedAt = 0
  private readonly plannedMs: number
  private readonly offsetsMs: number[]

  constructor(segments: readonly ClockSegment[], now: () => number) {
    if (segments.some(segment => !Number.isFinite(segment.durationS) || segment.durationS < 0)) {
      throw new RangeError('Every segment needs a duration of 0 seconds or more')
    }
    this.segments = segments
    this.now = now
    let offset = 0
    this.offsetsMs = segments.map((segment) => {
      const start = offset
      offset += segment.durationS * 1000
      return start
    })
    this.plannedMs = offset
  }

  get length() {
    return this.segments.length
  }

  start(): ClockChange[] {
    if (this.status !== 'ready') return []
    if (this.segments.length === 0) {
      this.status = 'finished'
      return []
    }
    this.status = 'running'
    this.segmentStart = this.now()
    return this.update()
  }

  pause() {
    if (this.status !== 'running') return
    this.update()
    if (this.status !== 'running') return
    this.pausedAt = this.now()
    this.status = 'paused'
  }

  /** Continues exactly where the pause began: the whole remaining schedule moves by the pause. */
  resume() {
    if (this.status !== 'paused') return
    this.segmentStart += this.now() - this.pausedAt
    this.status = 'running'
  }

  /**
   * Moves the schedule forward to `now()`: every timed segment whose absolute end has passed ends at
   * that end (not at the moment we noticed), so a late or missed tick never stretches the session.
   */
  update(): ClockChange[] {
    const changes: ClockChange[] = []
    if (this.status !== 'running') return changes
    const now = this.now()
    while (this.status === 'running') {
      const segment = this.segments[this.index]!
      if (segment.manual) break
      const end = this.segmentStart + segment.durationS * 1000
      if (now < end) break
      changes.push(this.advance(end, 'time', segment.durationS * 1000))
    }
    return changes
  }

  /** Ends a manual segment (or a timed one early) now, counting it as completed. */
  done(): ClockChange[] {
    const earlier = this.update()
    if (this.status !== 'running' && this.status !== 'paused') return earlier
    const at = this.activeNow()
    return [...earlier, this.advance(at, 'done', at - this.segmentStart)]
  }

  /** Leaves the current segment now without completing it. */
  skip(): ClockChange[] {
    const earlier = this.update()
    if (this.status !== 'running' && this.status !== 'paused') return earlier
    const at = this.activeNow()
    return [...earlier, this.advance(at, 'skip', at - this.segmentStart)]
  }

  /** Goes back to the start of the previous segment (or restarts the first). */
  back(): ClockChange[] {
    const earlier = this.update()
    if (this.status === 'ready') return earlier
    const at = this.status === 'finished' ? this.now() : this.activeNow()
    const spent = this.status === 'finished' ? 0 : at - this.segmentStart
    const from = this.index
    const to = this.status === 'finished' ? this.segments.length - 1 : Math.max(0, this.index - 1)
    if (this.status === 'finished') this.status = 'running'
    this.doneMs = Math.max(0, this.doneMs + spent)
    this.index = to
    this.segmentStart = this.status === 'paused' ? this.pausedAt : at
    return [...earlier, { from, to, scheduledAt: at, reason: 'back', spentMs: spent }]
  }

  /** Ends the session now, wherever it stands (the athlete stops early). */
  end(): ClockChange[] {
    const earlier = this.update()
    if (this.status !== 'running' && this.status !== 'paused') return earlier
    const at = this.activeNow()
    const spent = at - this.segmentStart
    const from = this.index
    this.doneMs += Math.max(0, spent)
    this.status = 'finished'
    return [...earlier, { from, to: this.segments.length, scheduledAt: at, reason: 'skip', spentMs: spent }]
  }

  state(): ClockState {
    if (this.status === 'running') this.update()
    const segment = this.segments[this.index]
    const elapsedMs = this.status === 'ready' || this.status === 'finished' ? 0 : Math.max(0, this.activeNow() - this.segmentStart)
    const durationMs = (segment?.durationS ?? 0) * 1000
    const remainingMs = !segment || segment.manual ? null : this.status === 'finished' ? 0 : Math.max(0, durationMs - elapsedMs)
    const plannedBehind = this.status === 'finished'
      ? this.plannedMs
      : (this.offsetsMs[this.index] ?? 0) + Math.min(elapsedMs, durationMs)
    return {
      status: this.status,
      index: this.index,
      elapsedMs,
      remainingMs,
      waiting: Boolean(segment?.manual) && (this.status === 'running' || this.status === 'paused'),
      totalElapsedMs: this.doneMs + elapsedMs,
      progress: this.plannedMs > 0 ? Math.min(1, plannedBehind / this.plannedMs) : this.status === 'finished' ? 1 : 0,
    }
  }

  /** Absolute time (on the `now()` line) the current timed segment ends; null if manual or stopped. */
  segmentEndsAt(): number | null {
    const segment = this.segments[this.index]
    if (this.status !== 'running' || !segment || segment.manual) return null
    return this.segmentStart + segment.durationS * 1000
  }

  /**
   * The current timed segment and the timed ones straight after it, each with its absolute start and end on
   * the `now()` line (a pause shifts them all); stops at the first manual segment. Empty unless running.
   */
  upcomingSegments(): { index: number, startsAt: number, endsAt: number }[] {
    const upcoming: { index: number, startsAt: number, endsAt: number }[] = []
    if (this.status !== 'running') return upcoming
    let startsAt = this.segmentStart
    for (let index = this.index; index < this.segments.length; index++) {
      const segment = this.segments[index]!
      if (segment.manual) break
      const endsAt = startsAt + segment.durationS * 1000
      upcoming.push({ index, startsAt, endsAt })
      startsAt = endsAt
    }
    return upcoming
  }

  /** Where the session stands, for storing; `restore` brings it back paused at that point. */
  snapshot(): ClockSnapshot {
    const state = this.state()
    return { status: state.status, index: state.index, elapsedMs: state.elapsedMs, totalElapsedMs: state.totalElapsedMs }
  }

  static restore(segments: readonly ClockSegment[], now: () => number, snapshot: ClockSnapshot): SessionClock {
    const clock = new SessionClock(segments, now)
    if (snapshot.status === 'ready' || segments.length === 0) return clock
    if (snapshot.status === 'finished') {
      clock.status = 'finished'
      clock.index = segments.length - 1
      clock.doneMs = snapshot.totalElapsedMs
      return clock
    }
    const index = Math.min(Math.max(0, Math.trunc(snapshot.index)), segments.length - 1)
    const elapsed = Math.max(0, snapshot.elapsedMs)
    const at = now()
    clock.index = index
    clock.doneMs = Math.max(0, snapshot.totalElapsedMs - elapsed)
    clock.segmentStart = at - elapsed
    clock.pausedAt = at
    clock.status = 'paused'
    return clock
  }

  private activeNow() {
    return this.status === 'paused' ? this.pausedAt : this.now()
  }

  private advance(at: number, reason: ClockChange['reason'], spentMs: number): ClockChange {
    const from = this.index
    this.doneMs += Math.max(0, spentMs)
    if (from >= this.segments.length - 1) {
      this.status = 'finished'
      return { from, to: this.segments.length, scheduledAt: at, reason, spentMs }
    }
    this.index = from + 1
    this.segmentStart = at
    if (this.status === 'paused') this.pausedAt = at
    return { from, to: this.index, scheduledAt: at, reason, spentMs }
  }
}
