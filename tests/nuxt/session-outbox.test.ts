import { beforeEach, describe, expect, it, vi } from 'vitest'
import { registerEndpoint } from '@nuxt/test-utils/runtime'
import { createError, readBody } from 'h3'
import { setActivePinia, createPinia } from 'pinia'

const calls: { path: string, body: unknown }[] = []
let entryAnswer: 'ok' | 'refuse' | 'down' = 'ok'

registerEndpoint('/api/assignments/7/sessions', {
  method: 'POST',
  handler: async (event) => {
    calls.push({ path: 'start', body: await readBody(event) })
    return { id: 41 }
  },
})
registerEndpoint('/api/sessions/41/entries', {
  method: 'POST',
  handler: async (event) => {
    calls.push({ path: 'entry', body: await readBody(event) })
    if (entryAnswer === 'down') throw createError({ statusCode: 503, message: 'Down for a moment' })
    if (entryAnswer === 'refuse') {
      throw createError({ statusCode: 409, message: 'Too late', data: { message: 'Sessions can be changed for 7 days after they start', fields: {} } })
    }
    return { id: 900 + calls.length }
  },
})

const entry = (key: string) => ({ idempotencyKey: key, stepId: 'squat', set: 1, round: null, reps: 5, kg: 60, seconds: null, meters: null, rpe: null, exerciseId: 1 })

/** Starts session `clientId` and, once the server has given it an id, queues entry `key` for the server to answer with `answer`. */
async function queueEntryAfterStart(clientId: string, key: string, answer: typeof entryAnswer) {
  const outbox = useSessionOutboxStore()
  outbox.enqueue({ kind: 'start', clientId, assignmentId: 7, startedAt: Date.now() })
  await vi.waitFor(() => expect(outbox.sessions[clientId]).toBe(41))
  entryAnswer = answer
  outbox.enqueue({ kind: 'entry', clientId, entry: entry(key) } as never)
  return outbox
}

describe('session outbox store', () => {
  beforeEach(() => {
    localStorage.clear()
    calls.length = 0
    entryAnswer = 'ok'
    setActivePinia(createPinia())
  })

  it('starts the session, then sends entries in order and remembers the server ids', async () => {
    const outbox = useSessionOutboxStore()
    outbox.enqueue({ kind: 'start', clientId: 'c1', assignmentId: 7, startedAt: Date.now() })
    outbox.enqueue({ kind: 'entry', clientId: 'c1', entry: entry('k1') } as never)
    await outbox.flush()
    await vi.waitFor(() => expect(outbox.queue).toHaveLength(0))
    expect(calls.map(call => call.path)).toEqual(['start', 'entry'])
    expect(outbox.sessions.c1).toBe(41)
    expect(outbox.entries.k1).toBeGreaterThan(900)
    expect(JSON.parse(localStorage.getItem('switchback.outbox.v1')!).queue).toEqual([])
  })

  it('keeps an entry queued (and stored) while the server is unreachable', async () => {
    const outbox = await queueEntryAfterStart('c2', 'k2', 'down')
    await vi.waitFor(() => expect(calls.filter(call => call.path === 'entry')).toHaveLength(1))
    await vi.waitFor(() => expect(outbox.sending).toBe(false))
    expect(outbox.pendingFor('c2')).toBe(1)
    expect(outbox.rejected).toEqual([])
    expect(JSON.parse(localStorage.getItem('switchback.outbox.v1')!).queue).toHaveLength(1)
  })

  it('drops a refused entry with the server\'s own message and goes on', async () => {
    const outbox = await queueEntryAfterStart('c3', 'k3', 'refuse')
    await vi.waitFor(() => expect(outbox.rejected).toHaveLength(1))
    expect(outbox.rejected[0]!.message).toBe('Sessions can be changed for 7 days after they start')
    expect(outbox.pendingFor('c3')).toBe(0)
  })
})
