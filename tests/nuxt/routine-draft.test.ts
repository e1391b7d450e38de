import { beforeEach, describe, expect, it } from 'vitest'
import { registerEndpoint } from '@nuxt/test-utils/runtime'
import { createError } from 'h3'
import { createPinia, setActivePinia } from 'pinia'

// The builder's draft inside the app: a refusal from the server, read by readApiError, lands on the step.
registerEndpoint('/api/routines/7', {
  method: 'PUT',
  handler: () => {
    throw createError({
      statusCode: 400,
      message: 'steps.1.steps.0.measure.seconds: Time must be more than 0 seconds',
      data: { message: 'steps.1.steps.0.measure.seconds: Time must be more than 0 seconds', fields: { 'steps.1.steps.0.measure.seconds': 'Time must be more than 0 seconds', 'title': 'Titles are at most 120 characters' } },
    })
  },
})

describe('routine draft store with the app\'s error reader', () => {
  beforeEach(() => setActivePinia(createPinia()))

  it('puts the server\'s field messages on the right nested step and on the routine', async () => {
    const draft = useRoutineDraftStore()
    draft.load({
      id: 7,
      version: 1,
      title: 'Short hills',
      category: 'hills',
      description: '',
      steps: [
        { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 600 } },
        { id: 'hills', type: 'repeat', times: 6, steps: [{ id: 'up', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 } }] },
      ],
    })
    const failure = await $fetch('/api/routines/7', { method: 'PUT', body: draft.payload() }).catch((error: unknown) => error)
    const refused = readApiError(failure)
    expect(refused.status).toBe(400)
    draft.applyServerErrors(refused.fields)
    expect(draft.stepErrors.up).toEqual({ 'measure.seconds': 'Time must be more than 0 seconds' })
    expect(draft.stepErrors.warm).toBeUndefined()
    expect(draft.routineErrors.title).toBe('Titles are at most 120 characters')
    expect(draft.errorCount).toBe(2)
  })

  it('forgets server messages once the steps are edited and checked again', () => {
    const draft = useRoutineDraftStore()
    draft.load({ id: 7, version: 1, title: 'Strides', category: 'drills', description: '', steps: [{ id: 'run', type: 'block', kind: 'work', measure: { by: 'time', seconds: 20 } }] })
    expect(draft.valid).toBe(true)
    draft.updateStep('run', { measure: { by: 'time', seconds: 0 } })
    expect(draft.valid).toBe(false)
    expect(draft.stepErrors.run?.['measure.seconds']).toMatch(/more than 0/)
    draft.undo()
    expect(draft.valid).toBe(true)
  })
})
