import { CLIP_CUE_LIMITS, type ClipCueInput, type ClipCueView } from '#shared/schemas/clip-cue'

function fieldsOf(error: unknown): Record<string, string> {
  const refused = readApiError(error, 'The cue could not be saved; try again')
  return Object.keys(refused.fields).length ? refused.fields : { _: refused.message }
}

const round = (seconds: number) => Math.round(seconds * 1000) / 1000

/**
 * The cues pinned to an exercise's clip, and the coach's actions on them. Every change goes to the
 * server and `version` goes up, so the captions track can be fetched again.
 */
export function useClipCues(exerciseId: MaybeRefOrGetter<number>) {
  const cues = ref<ClipCueView[]>([])
  const errors = ref<Record<string, string>>({})
  const busy = ref(false)
  const version = ref(0)
  const base = () => `/api/exercises/${toValue(exerciseId)}/cues`

  function sort() {
    cues.value = [...cues.value].sort((a, b) => a.startSeconds - b.startSeconds || a.id - b.id)
  }

  async function run<T>(action: () => Promise<T>): Promise<T | null> {
    busy.value = true
    errors.value = {}
    try {
      const result = await action()
      version.value += 1
      return result
    }
    catch (error) {
      errors.value = fieldsOf(error)
      return null
    }
    finally {
      busy.value = false
    }
  }

  async function load() {
    try {
      cues.value = await $fetch<ClipCueView[]>(base())
    }
    catch (error) {
      errors.value = fieldsOf(error)
    }
  }

  async function add(input: ClipCueInput) {
    if (cues.value.length >= CLIP_CUE_LIMITS.perClip) {
      errors.value = { cues: `A clip has at most ${CLIP_CUE_LIMITS.perClip} cues; remove one first` }
      return null
    }
    const created = await run(() => $fetch<ClipCueView>(base(), { method: 'POST', body: input }))
    if (created) {
      cues.value.push(created)
      sort()
    }
    return created
  }

  async function update(id: number, change: Partial<Pick<ClipCueView, 'startSeconds' | 'endSeconds' | 'text'>>) {
    const updated = await run(() => $fetch<ClipCueView>(`${base()}/${id}`, { method: 'PATCH', body: change }))
    if (updated) {
      cues.value = cues.value.map(cue => (cue.id === id ? updated : cue))
      sort()
    }
    return updated
  }

  /** Moves a cue to a new start, keeping its length when it has an end. */
  function move(id: number, startSeconds: number, durationSeconds: number) {
    const cue = cues.value.find(item => item.id === id)
    if (!cue) return Promise.resolve(null)
    const length = cue.endSeconds === null ? null : cue.endSeconds - cue.startSeconds
    const start = round(Math.min(Math.max(0, startSeconds), length === null ? durationSeconds : durationSeconds - length))
    return update(id, { startSeconds: start, endSeconds: length === null ? null : round(start + length) })
  }

  async function remove(id: number) {
    const done = await run(() => $fetch<null>(`${base()}/${id}`, { method: 'DELETE' }).then(() => true))
    if (done !== null) cues.value = cues.value.filter(cue => cue.id !== id)
  }

  async function fit(mode: 'scale' | 'clamp', fromSeconds?: number) {
    const fitted = await run(() => $fetch<ClipCueView[]>(`${base()}/fit`, { method: 'POST', body: { mode, fromSeconds } }))
    if (fitted) cues.value = fitted
  }

  return { cues: readonly(cues), errors: readonly(errors), busy: readonly(busy), version: readonly(version), load, add, update, move, remove, fit }
}
