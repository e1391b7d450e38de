// Which beeps the session player sounds, and when: worked out ahead from the clock's absolute segment ends,
// so they can be put on the audio clock before they are due instead of played when the screen catches up.

export interface PlannedBeep {
  /** Stable for one beep of one boundary (the segment ending and how many seconds before its end). */
  key: string
  kind: 'countdown' | 'change'
  /** Index of the segment whose end this beep belongs to. */
  boundary: number
  /** When that segment ends. */
  boundaryAt: number
  /** When the beep starts: the end itself, or one of the last three whole seconds before it. */
  at: number
}

const COUNTDOWN_SECONDS = [3, 2, 1]

/**
 * The countdown beeps (3, 2 and 1 s before a timed segment ends, never at the very start of the segment,
 * where the change beep already sounds) and the change beep at each end, from `from` to `until`, in time order.
 * Times are in milliseconds on the line `segments` uses.
 */
export function plannedBeeps(
  segments: { index: number, startsAt: number, endsAt: number }[],
  range: { from: number, until: number },
): PlannedBeep[] {
  const beeps: PlannedBeep[] = []
  for (const segment of segments) {
    if (segment.startsAt > range.until) break
    for (const before of COUNTDOWN_SECONDS) {
      const at = segment.endsAt - before * 1000
      if (at > segment.startsAt) beeps.push({ key: `${segment.index}:${before}`, kind: 'countdown', boundary: segment.index, boundaryAt: segment.endsAt, at })
    }
    beeps.push({ key: `${segment.index}:0`, kind: 'change', boundary: segment.index, boundaryAt: segment.endsAt, at: segment.endsAt })
  }
  return beeps.filter(beep => beep.at >= range.from && beep.at <= range.until)
}
