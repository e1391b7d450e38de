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
    const outbox = useSessionOutboxStore()
    outbox.enqueue({ kind: 'start', clientId: 'c2', assignmentId: 7, startedAt: Date.now() })
    await vi.waitFor(() => expect(outbox.sessions.c2).toBe(41))
    entryAnswer = 'down'
    outbox.enqueue({ kind: 'entry', clientId: 'c2', entry: entry('k2') } as never)
    await vi.waitFor(() => expect(calls.filter(call => call.path === 'entry')).toHaveLength(1))
    await vi.waitFor(() => expect(outbox.sending).toBe(false))
    expect(outbox.pendingFor('c2')).toBe(1)
    expect(outbox.rejected).toEqual([])
    expect(JSON.parse(localStorage.getItem('switchback.outbox.v1')!).queue).toHaveLength(1)
  })

  it('drops a refused entry with the server\'s own message and goes on', async () => {
    const outbox = useSessionOutboxStore()
    outbox.enqueue({ kind: 'start', clientId: 'c3', assignmentId: 7, startedAt: Date.now() })
    await vi.waitFor(() => expect(outbox.sessions.c3).toBe(41))
    entryAnswer = 'refuse'
    outbox.enqueue({ kind: 'entry', clientId: 'c3', entry: entry('k3') } as never)
    await vi.waitFor(() => expect(outbox.rejected).toHaveLength(1))
    expect(outbox.rejected[0]!.message).toBe('Sessions can be changed for 7 days after they start')
    expect(outbox.pendingFor('c3')).toBe(0)
  })
})
