import { describe, expect, it } from 'vitest'
import { carryLoadForward } from '../../shared/utils/session-load'

const segments = [
  { key: 'squat:0:1', stepId: 'squat', loggable: true },
  { key: 'squat:0:1:rest', stepId: 'squat', loggable: false },
  { key: 'squat:0:2', stepId: 'squat', loggable: true },
  { key: 'squat:0:3', stepId: 'squat', loggable: true },
  { key: 'lunge:0:1', stepId: 'lunge', loggable: true },
]
const draft = (kg: number | null) => ({ reps: 8, kg })

describe('carryLoadForward', () => {
  it('starts the later sets of the same step from the load just logged', () => {
    const drafts = { 'squat:0:1': draft(16), 'squat:0:2': draft(16), 'squat:0:3': draft(16), 'lunge:0:1': draft(10) }
    expect(carryLoadForward(segments, 0, 14, drafts, {})).toEqual({ 'squat:0:2': draft(14), 'squat:0:3': draft(14) })
  })

  it('leaves other steps, sets already logged and a set logged without a load alone', () => {
    const drafts = { 'squat:0:2': draft(16), 'squat:0:3': draft(16), 'lunge:0:1': draft(10) }
    expect(carryLoadForward(segments, 2, 18, drafts, { 'squat:0:3': {} })).toEqual({})
    expect(carryLoadForward(segments, 0, null, drafts, {})).toEqual({})
    expect(carryLoadForward(segments, 3, 20, drafts, {})).toEqual({})
  })
})
