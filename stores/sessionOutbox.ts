import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import type { EntryInput, FinishInput } from '#shared/schemas/session'

// Everything the player sends goes through here: kept in localStorage until the server has it,
// sent in order, retried when the connection returns. Every call is idempotent on the server
// (clientId for the session, idempotencyKey for an entry), so a retry never doubles anything.

type EntryValues = Pick<EntryInput, 'reps' | 'kg' | 'seconds' | 'meters' | 'rpe'>

export type OutboxOperation
  = | { id: string, kind: 'start', clientId: string, assignmentId: number, startedAt: number }
    | { id: string, kind: 'entry', clientId: string, entry: EntryInput }
    | { id: string, kind: 'patch', clientId: string, idempotencyKey: string, values: EntryValues }
    | { id: string, kind: 'finish', clientId: string, finish: FinishInput }

type WithoutId<T> = T extends unknown ? Omit<T, 'id'> : never
export type NewOutboxOperation = WithoutId<OutboxOperation>

interface StoredOutbox {
  queue: OutboxOperation[]
  /** Server session ids by clientId. */
  sessions: Record<string, number>
  /** Server entry ids by idempotency key. */
  entries: Record<string, number>
  /** Finish answers by clientId, e.g. the pain flags raised. */
  finished: Record<string, { status: string | null, flags: number }>
}

const STORAGE_KEY = 'switchback.outbox.v1'
const RETRY_MS = 15_000

function isNetworkFailure(error: unknown) {
  const { status } = readApiError(error)
  return !status || status >= 500 || status === 408 || status === 429
}

function messageOf(error: unknown) {
  return readApiError(error, (error as Error)?.message || 'Could not save').message
}

export const useSessionOutboxStore = defineStore('sessionOutbox', () => {
  const queue = ref<OutboxOperation[]>([])
  const sessions = ref<Record<string, number>>({})
  const entries = ref<Record<string, number>>({})
  const finished = ref<Record<string, { status: string | null, flags: number }>>({})
  const rejected = ref<{ operation: OutboxOperation, message: string }[]>([])
  const online = ref(true)
  const sending = ref(false)
  const lastSentAt = ref<number | null>(null)
  let loaded = false
  let retryTimer: ReturnType<typeof setTimeout> | undefined

  const pending = computed(() => queue.value.length)

  function save() {
    if (!import.meta.client) return
    const stored: StoredOutbox = { queue: queue.value, sessions: sessions.value, entries: entries.value, finished: finished.value }
    try {
      localStorage.setItem(STORAGE_KEY, JSON.stringify(stored))
    }
    catch {
      // Storage full or blocked: the queue still lives in memory for this visit.
    }
  }

  function load() {
    if (loaded || !import.meta.client) return
    loaded = true
    try {
      const stored = JSON.parse(localStorage.getItem(STORAGE_KEY) ?? 'null') as StoredOutbox | null
      if (stored) {
        queue.value = stored.queue ?? []
        sessions.value = stored.sessions ?? {}
        entries.value = stored.entries ?? {}
        finished.value = stored.finished ?? {}
      }
    }
    catch {
      // A damaged store starts afresh rather than blocking the player.
    }
    online.value = navigator.onLine
    window.addEventListener('online', () => {
      online.value = true
      void flush()
    })
    window.addEventListener('offline', () => {
      online.value = false
    })
    if (queue.value.length) void flush()
  }

  function enqueue(operation: NewOutboxOperation) {
    load()
    queue.value.push({ ...operation, id: `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}` } as OutboxOperation)
    save()
    void flush()
  }

  async function send(operation: OutboxOperation) {
    if (operation.kind === 'start') {
      const session = await $fetch<{ id: number }>(`/api/assignments/${operation.assignmentId}/sessions`, { method: 'POST', body: { clientId: operation.clientId, startedAt: operation.startedAt } })
      sessions.value[operation.clientId] = session.id
      return
    }
    const sessionId = sessions.value[operation.clientId]
    if (!sessionId) throw Object.assign(new Error('The session has not been started on the server'), { statusCode: 400 })
    if (operation.kind === 'entry') {
      const entry = await $fetch<{ id: number }>(`/api/sessions/${sessionId}/entries`, { method: 'POST', body: operation.entry })
      entries.value[operation.entry.idempotencyKey] = entry.id
    }
    else if (operation.kind === 'patch') {
      const entryId = entries.value[operation.idempotencyKey]
      if (!entryId) throw Object.assign(new Error('That set has not reached the server'), { statusCode: 400 })
      await $fetch(`/api/entries/${entryId}`, { method: 'PATCH', body: operation.values })
    }
    else {
      const result = await $fetch<{ status: string | null, flags: unknown[] }>(`/api/sessions/${sessionId}/finish`, { method: 'POST', body: operation.finish })
      finished.value[operation.clientId] = { status: result.status, flags: result.flags.length }
    }
  }

  /** Sends the queue in order; stops at the first network failure and tries again later. */
  async function flush() {
    load()
    if (sending.value || !queue.value.length) return
    sending.value = true
    clearTimeout(retryTimer)
    try {
      while (queue.value.length) {
        const operation = queue.value[0]!
        try {
          await send(operation)
          lastSentAt.value = Date.now()
        }
        catch (error) {
          if (isNetworkFailure(error)) {
            retryTimer = setTimeout(() => void flush(), RETRY_MS)
            return
          }
          // The server refused it for good (e.g. too late to edit): keep the reason, move on.
          rejected.value.push({ operation, message: messageOf(error) })
        }
        queue.value.shift()
        save()
      }
    }
    finally {
      sending.value = false
      save()
    }
  }

  /** Drops everything kept for this person (sign-out); storage itself is cleared by the caller. */
  function forget() {
    clearTimeout(retryTimer)
    queue.value = []
    sessions.value = {}
    entries.value = {}
    finished.value = {}
    rejected.value = []
    lastSentAt.value = null
  }

  function pendingFor(clientId: string) {
    return queue.value.filter(operation => operation.clientId === clientId).length
  }

  return { queue, sessions, entries, finished, rejected, online, sending, pending, lastSentAt, load, enqueue, flush, pendingFor, forget }
})
