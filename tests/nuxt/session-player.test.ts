import { beforeEach, describe, expect, it, vi } from 'vitest'
import { registerEndpoint } from '@nuxt/test-utils/runtime'
import { createPinia, setActivePinia } from 'pinia'
import { planSession } from '#shared/utils/session-plan'
import type { PlayerPlan } from '~/stores/sessionPlayer'

// The outbox sends to these while the player runs; the player's own state is what is checked here.
registerEndpoint('/api/assignments/5/sessions', { method: 'POST', handler: () => ({ id: 12 }) })
registerEndpoint('/api/sessions/12/entries', { method: 'POST', handler: () => ({ id: 300 }) })

function playerPlan(): PlayerPlan {
  const plan = planSession({
    title: 'Legs',
    category: 'strength',
    description: '',
    exercises: [{ id: 1, name: 'Split squat', category: 'strength', summary: '', cues: [], equipment: [], cautions: [] }],
    steps: [{ id: 'split', type: 'sets', exerciseId: 1, sets: 2, perSet: { by: 'reps', reps: 8 }, restSeconds: 60, target: { type: 'load', kg: 20 } }],
  }, { paces: null, estimatedMaxKg: {}, injuryNotes: [] })
  return {
    clipExerciseIds: [],
    assignment: { id: 5, date: '2026-03-02', note: '', status: 'planned', routineId: 3 },
    athlete: { name: 'Tamsin Rook', units: 'km', hasBenchmark: false, activeInjuries: [] },
    plan,
    sessions: [],
  }
}

describe('session player store', () => {
  beforeEach(() => {
    localStorage.clear()
    setActivePinia(createPinia())
  })

  it('logs a set with its planned reps and the corrected load when the athlete marks it done', async () => {
    const player = useSessionPlayerStore()
    player.open(playerPlan())
    player.acknowledge()
    player.start()
    expect(player.current?.stepId).toBe('split')
    const firstSet = player.current!.key
    player.updateDraft(firstSet, { kg: 22.5 })
    player.act('done')
    expect(player.logged[firstSet]).toMatchObject({ reps: 8, kg: 22.5, seconds: null, set: 1 })
    expect(player.current?.kind).toBe('rest')
    expect(player.loggedList).toHaveLength(1)
    // The outbox delivers the start and then the set, keyed so that a retry cannot log it twice.
    const outbox = useSessionOutboxStore()
    await vi.waitFor(() => expect(outbox.entries[`${player.clientId}:${firstSet}`]).toBe(300))
    expect(outbox.sessions[player.clientId]).toBe(12)
  })

  it('resumes a session after a reload with the same client id, logged sets and position', () => {
    const first = useSessionPlayerStore()
    first.open(playerPlan())
    first.acknowledge()
    first.start()
    first.act('done')
    const { clientId } = first
    const position = first.state!.index

    setActivePinia(createPinia())
    const again = useSessionPlayerStore()
    again.open(playerPlan())
    expect(again.resumed).toBe(true)
    expect(again.clientId).toBe(clientId)
    expect(again.state!.index).toBe(position)
    expect(Object.keys(again.logged)).toHaveLength(1)
  })

  it('starts afresh once the previous run was finished and sent', () => {
    const first = useSessionPlayerStore()
    first.open(playerPlan())
    first.start()
    first.finish({ sessionRpe: 6, pain: 0, note: '' } as never)
    expect(first.finishedSent).toBe(true)
    const { clientId } = first

    setActivePinia(createPinia())
    const again = useSessionPlayerStore()
    again.open(playerPlan())
    expect(again.resumed).toBe(false)
    expect(again.clientId).not.toBe(clientId)
    expect(again.logged).toEqual({})
  })
})
