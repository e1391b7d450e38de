import { defineStore } from 'pinia'
import { computed, markRaw, ref, shallowRef } from 'vue'
import type { FinishInput } from '#shared/schemas/session'
import type { SnapshotBlockWeek } from '#shared/types/domain'
import { SessionClock, type ClockChange, type ClockSnapshot, type ClockState } from '#shared/utils/session-clock'
import type { PlanSegment, SessionPlan } from '#shared/utils/session-plan'
import { carryLoadForward } from '#shared/utils/session-load'
import { useSessionOutboxStore } from './sessionOutbox'

export interface PlayerPlan {
  clipExerciseIds: number[]
  assignment: { id: number, date: string, note: string, status: string, routineId: number, block?: SnapshotBlockWeek | null }
  athlete: { name: string, units: 'km' | 'mi', hasBenchmark: boolean, under18?: boolean, activeInjuries: { id: number, bodyArea: string, note: string }[] }
  team?: { emergencyNumber: string | null }
  plan: SessionPlan
  sessions: { id: number, finishedAt: string | null, day: string }[]
}

export interface EntryDraft {
  reps: number | null
  kg: number | null
  seconds: number | null
  meters: number | null
  rpe: number | null
}

export interface LoggedEntry extends EntryDraft {
  key: string
  idempotencyKey: string
  label: string
  set: number | null
  round: number | null
}

interface StoredPlayer {
  clientId: string
  acknowledged: boolean
  started: boolean
  clock: ClockSnapshot
  drafts: Record<string, EntryDraft>
  logged: Record<string, LoggedEntry>
  finishedSent: boolean
  savedAt: number
}

/** A segment change as the athlete saw it: when it was due and when the screen showed it. */
export interface ChangeTiming {
  index: number
  scheduledAt: number
  shownAt: number
}

const storageKey = (assignmentId: number) => `switchback.player.${assignmentId}.v1`

function newClientId() {
  const random = typeof crypto !== 'undefined' && 'randomUUID' in crypto ? crypto.randomUUID() : `${Date.now().toString(36)}-${Math.random().toString(36).slice(2)}`
  return `s-${random}`
}

function draftFor(segment: PlanSegment): EntryDraft {
  return { reps: segment.reps, kg: segment.targetKg, seconds: segment.seconds, meters: segment.meters, rpe: null }
}

export const useSessionPlayerStore = defineStore('sessionPlayer', () => {
  const outbox = useSessionOutboxStore()
  const data = shallowRef<PlayerPlan | null>(null)
  const clientId = ref('')
  const acknowledged = ref(false)
  const started = ref(false)
  const resumed = ref(false)
  const finishedSent = ref(false)
  const drafts = ref<Record<string, EntryDraft>>({})
  const logged = ref<Record<string, LoggedEntry>>({})
  const state = ref<ClockState | null>(null)
  const timings = ref<ChangeTiming[]>([])
  let clock: SessionClock | null = null
  let now: () => number = () => performance.now()
  /** Routine seconds per real second (the test-only speed switch); the clock's line is performance.now × speed. */
  let speed = 1
  let listeners: ((changes: ClockChange[]) => void)[] = []
  /** Set at sign-out: the run on screen must not write itself back to the device as the page goes. */
  let forgotten = false

  const segments = computed(() => data.value?.plan.segments ?? [])
  const current = computed(() => (state.value ? segments.value[state.value.index] : undefined) ?? null)
  const next = computed(() => (state.value && state.value.status !== 'finished' ? segments.value[state.value.index + 1] : undefined) ?? null)
  const finished = computed(() => state.value?.status === 'finished')
  const loggedList = computed(() => segments.value.filter(segment => logged.value[segment.key]).map(segment => logged.value[segment.key]!))
  const loggableCount = computed(() => segments.value.filter(segment => segment.loggable).length)

  function clockSegments(plan: SessionPlan) {
    return plan.segments.map(segment => ({ durationS: segment.durationS, manual: segment.manual }))
  }

  function persist() {
    if (!import.meta.client || !data.value || !clock || forgotten) return
    const stored: StoredPlayer = {
      clientId: clientId.value,
      acknowledged: acknowledged.value,
      started: started.value,
      clock: clock.snapshot(),
      drafts: drafts.value,
      logged: logged.value,
      finishedSent: finishedSent.value,
      savedAt: Date.now(),
    }
    try {
      localStorage.setItem(storageKey(data.value.assignment.id), JSON.stringify(stored))
    }
    catch {
      // Could not store: the session still runs; only resuming after leaving is lost.
    }
  }

  /** Loads a plan; picks up a session left part-way on this device, paused where it was. */
  function open(plan: PlayerPlan, options: { speed?: number } = {}) {
    outbox.load()
    forgotten = false
    speed = options.speed && options.speed > 0 ? options.speed : 1
    now = speed === 1 ? () => performance.now() : () => performance.now() * speed
    data.value = markRaw(plan)
    timings.value = []
    resumed.value = false
    let stored: StoredPlayer | null = null
    try {
      stored = JSON.parse(localStorage.getItem(storageKey(plan.assignment.id)) ?? 'null') as StoredPlayer | null
    }
    catch {
      stored = null
    }
    if (stored && !stored.finishedSent) {
      clientId.value = stored.clientId
      acknowledged.value = stored.acknowledged
      started.value = stored.started
      drafts.value = stored.drafts ?? {}
      logged.value = stored.logged ?? {}
      finishedSent.value = false
      clock = SessionClock.restore(clockSegments(plan.plan), now, stored.clock)
      resumed.value = stored.started
    }
    else {
      reset()
    }
    state.value = clock!.state()
  }

  function reset() {
    clientId.value = newClientId()
    acknowledged.value = false
    started.value = false
    finishedSent.value = false
    logged.value = {}
    drafts.value = Object.fromEntries((data.value?.plan.segments ?? []).filter(segment => segment.loggable).map(segment => [segment.key, draftFor(segment)]))
    clock = new SessionClock(clockSegments(data.value!.plan), now)
    state.value = clock.state()
    if (data.value && import.meta.client) localStorage.removeItem(storageKey(data.value.assignment.id))
  }

  function onChanges(listener: (changes: ClockChange[]) => void) {
    listeners.push(listener)
    return () => {
      listeners = listeners.filter(item => item !== listener)
    }
  }

  function commit(segment: PlanSegment, change: ClockChange) {
    if (!segment.loggable) return
    if (change.reason !== 'time' && change.reason !== 'done') return
    const draft = drafts.value[segment.key] ?? draftFor(segment)
    const spentS = Math.round(change.spentMs / 100) / 10
    const values: EntryDraft = segment.measure === 'reps'
      ? { ...draft, seconds: null, meters: null }
      : { ...draft, reps: null, seconds: spentS, meters: segment.measure === 'distance' ? draft.meters : null }
    const idempotencyKey = `${clientId.value}:${segment.key}`
    const earlier = logged.value[segment.key]
    logged.value = { ...logged.value, [segment.key]: { ...values, key: segment.key, idempotencyKey, label: segment.label, set: segment.set, round: segment.round } }
    drafts.value = { ...drafts.value, ...carryLoadForward(segments.value, change.from, values.kg, drafts.value, logged.value) }
    if (earlier) {
      outbox.enqueue({ kind: 'patch', clientId: clientId.value, idempotencyKey, values: strip(values) })
      return
    }
    outbox.enqueue({
      kind: 'entry',
      clientId: clientId.value,
      entry: { idempotencyKey, stepId: segment.stepId, set: segment.set ?? undefined, round: segment.round ?? undefined, ...strip(values) },
    })
  }

  function strip(values: EntryDraft) {
    return {
      reps: values.reps ?? undefined,
      kg: values.kg ?? undefined,
      seconds: values.seconds ?? undefined,
      meters: values.meters ?? undefined,
      rpe: values.rpe ?? undefined,
    }
  }

  function handle(changes: ClockChange[]) {
    if (!changes.length) return
    for (const change of changes) {
      const segment = segments.value[change.from]
      if (segment) commit(segment, change)
    }
    state.value = clock!.state()
    for (const listener of listeners) listener(changes)
    persist()
  }

  /** Called on every animation frame (and a slower timer in the background): reads the clock. */
  function tick() {
    if (!clock) return
    const changes = clock.update()
    state.value = clock.state()
    if (changes.length) handle(changes)
  }

  /** The current timed segment and those straight after it, on the clock's line (for the beeps ahead). */
  function upcomingSegments() {
    return clock?.upcomingSegments() ?? []
  }

  /** A moment of performance.now's line on the clock's line. */
  function clockTime(realMs: number) {
    return realMs * speed
  }

  /** A moment of the clock's line on performance.now's line. */
  function realTime(clockMs: number) {
    return clockMs / speed
  }

  /** Records when a change due at `scheduledAt` reached the screen (for the timing figures). */
  function recordShown(change: ClockChange) {
    timings.value.push({ index: change.to, scheduledAt: change.scheduledAt, shownAt: now() })
  }

  function acknowledge() {
    acknowledged.value = true
    persist()
  }

  function start() {
    if (!clock || !data.value || started.value) return
    started.value = true
    outbox.enqueue({ kind: 'start', clientId: clientId.value, assignmentId: data.value.assignment.id, startedAt: Date.now() })
    handle(clock.start())
    state.value = clock.state()
    persist()
  }

  function act(action: 'pause' | 'resume' | 'skip' | 'back' | 'done' | 'end') {
    if (!clock) return
    if (action === 'pause') clock.pause()
    else if (action === 'resume') {
      clock.resume()
      resumed.value = false
    }
    else handle(clock[action]())
    state.value = clock.state()
    persist()
  }

  function togglePause() {
    act(state.value?.status === 'paused' ? 'resume' : 'pause')
  }

  function updateDraft(key: string, values: Partial<EntryDraft>) {
    drafts.value = { ...drafts.value, [key]: { ...(drafts.value[key] ?? { reps: null, kg: null, seconds: null, meters: null, rpe: null }), ...values } }
    persist()
  }

  /** A correction after the fact, on the review screen. */
  function correct(key: string, values: Partial<EntryDraft>) {
    const entry = logged.value[key]
    if (!entry) return
    const updated = { ...entry, ...values }
    logged.value = { ...logged.value, [key]: updated }
    outbox.enqueue({ kind: 'patch', clientId: clientId.value, idempotencyKey: entry.idempotencyKey, values: strip(updated) })
    persist()
  }

  function finish(input: Omit<FinishInput, 'durationS'>) {
    if (!clock) return
    if (clock.state().status !== 'finished') handle(clock.end())
    outbox.enqueue({ kind: 'finish', clientId: clientId.value, finish: { ...input, durationS: Math.round(clock.state().totalElapsedMs / 1000) } })
    finishedSent.value = true
    persist()
  }

  function forget() {
    forgotten = true
  }

  return {
    data, clientId, acknowledged, started, resumed, finishedSent, drafts, logged, state, timings,
    segments, current, next, finished, loggedList, loggableCount,
    open, reset, onChanges, tick, upcomingSegments, clockTime, realTime, recordShown, acknowledge, start, act, togglePause, updateDraft, correct, finish, persist, forget,
  }
})
