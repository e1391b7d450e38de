import type { PlannedBeep } from '#shared/utils/session-beeps'

/** A beep put on the audio clock, as the test-only record shows it (`window.switchbackBeeps`). */
export interface ScheduledBeep extends PlannedBeep {
  /** Its start on the audio clock (seconds). */
  audioAt: number
  cancelled: boolean
  /**
   * For a change beep: when it will be heard on performance.now's line, read again from the audio clock when
   * the player reached its boundary (so drift between the clocks since scheduling shows).
   */
  heardAt?: number
}

/** A beep already scheduled is moved only when its time on the audio clock would change by more than this. */
const DRIFT_S = 0.002

const scheduled = new Map<string, { beep: ScheduledBeep, oscillator: OscillatorNode }>()
const record: ScheduledBeep[] = []

/** Where a moment on performance.now's line falls on the audio clock, as it will be heard. */
function audioTimeAt(context: AudioContext, performanceMs: number) {
  const stamp = context.getOutputTimestamp?.()
  if (stamp?.performanceTime && stamp.contextTime !== undefined) return stamp.contextTime + (performanceMs - stamp.performanceTime) / 1000
  return context.currentTime + (performanceMs - performance.now()) / 1000
}

/** The inverse: when a moment of the audio clock will be heard, on performance.now's line. */
function performanceTimeAt(context: AudioContext, contextSeconds: number) {
  const stamp = context.getOutputTimestamp?.()
  if (stamp?.performanceTime && stamp.contextTime !== undefined) return stamp.performanceTime + (contextSeconds - stamp.contextTime) * 1000
  return performance.now() + (contextSeconds - context.currentTime) * 1000
}

function tone(context: AudioContext, kind: PlannedBeep['kind'], start: number) {
  const { frequency, seconds, volume } = kind === 'change' ? { frequency: 990, seconds: 0.35, volume: 0.35 } : { frequency: 660, seconds: 0.12, volume: 0.25 }
  const oscillator = context.createOscillator()
  const gain = context.createGain()
  oscillator.frequency.value = frequency
  oscillator.type = 'sine'
  gain.gain.setValueAtTime(volume, start)
  gain.gain.exponentialRampToValueAtTime(0.001, start + seconds)
  oscillator.connect(gain).connect(context.destination)
  oscillator.start(start)
  oscillator.stop(start + seconds)
  return oscillator
}

/**
 * The session runner's beeps, put on the audio clock ahead of their boundaries so a busy page cannot make
 * them late (the page's audio context comes from useSessionCues' unlock). Used by the runner only, so it is
 * not part of the player's first load.
 */
export function useBeepSchedule() {
  const { settings } = useSessionCues()
  // The record of scheduled beeps is kept only where the test-only speed switch is allowed.
  const recording = useRuntimeConfig().public.playerSpeedParam

  /**
   * Puts the planned beeps (times on performance.now's line) on the audio clock; beeps scheduled earlier that
   * are no longer planned (a pause, a skip, sound switched off) are cancelled, and any whose time moved (a
   * resume, a step back) are scheduled again.
   */
  function schedule(planned: PlannedBeep[]) {
    const context = sessionAudio()
    if (!context || context.state !== 'running') return
    const wanted = new Map((settings.value.sound ? planned : []).map(beep => [beep.key, beep]))
    const now = context.currentTime
    for (const [key, { beep, oscillator }] of scheduled) {
      const plannedNow = wanted.get(key)
      const moved = plannedNow !== undefined && Math.abs(audioTimeAt(context, plannedNow.at) - beep.audioAt) > DRIFT_S
      if (beep.audioAt <= now) {
        // Sounding or done: left alone, and kept a while so its boundary can still be looked up, unless the
        // same boundary comes round again (a step back).
        if (beep.audioAt < now - 2 || moved) scheduled.delete(key)
        if (!moved) wanted.delete(key)
      }
      else if (!plannedNow || moved) {
        oscillator.stop()
        oscillator.disconnect()
        beep.cancelled = true
        scheduled.delete(key)
      }
      else {
        wanted.delete(key)
      }
    }
    for (const beep of wanted.values()) {
      const audioAt = audioTimeAt(context, beep.at)
      if (audioAt < now) continue
      const entry: ScheduledBeep = { ...beep, audioAt, cancelled: false }
      scheduled.set(beep.key, { beep: entry, oscillator: tone(context, beep.kind, audioAt) })
      if (recording) record.push(entry)
    }
  }

  /** Cancels every beep not yet sounding (the runner is leaving). */
  function cancel() {
    schedule([])
  }

  /**
   * A step change reached the screen: a change on time (`boundary`: the segment that ended and when) had
   * its beep scheduled ahead; one the athlete made (skip, done, back), or one that was missed, beeps now.
   */
  function atChange(boundary?: { index: number, at: number }) {
    const context = sessionAudio()
    const ahead = boundary ? scheduled.get(`${boundary.index}:0`)?.beep : undefined
    const onTime = ahead !== undefined && !ahead.cancelled && Math.abs(ahead.boundaryAt - boundary!.at) < 1
    if (onTime && context && recording) ahead.heardAt = performanceTimeAt(context, ahead.audioAt)
    if (!onTime && settings.value.sound && context?.state === 'running') tone(context, 'change', context.currentTime)
  }

  return { schedule, cancel, atChange, record: record as readonly ScheduledBeep[] }
}
