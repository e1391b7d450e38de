import { describe, expect, it } from 'vitest'
import { renderEmail } from '../../server/utils/email-templates'
import { exerciseIdsIn } from '../../server/utils/snapshot'
import { shownStatus } from '../../shared/utils/assignment-status'
import type { RoutineStep } from '../../shared/schemas/routine-steps'

describe('shownStatus', () => {
  it('is overdue only for planned sessions before the athlete\'s today', () => {
    expect(shownStatus('planned', '2027-03-01', '2027-03-02')).toBe('overdue')
    expect(shownStatus('planned', '2027-03-02', '2027-03-02')).toBe('planned')
    expect(shownStatus('done', '2027-03-01', '2027-03-02')).toBe('done')
    expect(shownStatus('partial', '2027-03-01', '2027-03-02')).toBe('partial')
    expect(shownStatus('skipped', '2027-03-01', '2027-03-02')).toBe('skipped')
  })
})

describe('exerciseIdsIn', () => {
  it('collects exercise ids from nested repeats once, in first-use order', () => {
    const steps: RoutineStep[] = [
      { id: 'a', type: 'sets', exerciseId: 7, sets: 3, perSet: { by: 'reps', reps: 8 }, restSeconds: 90 },
      { id: 'b', type: 'repeat', times: 2, steps: [
        { id: 'c', type: 'block', kind: 'work', measure: { by: 'time', seconds: 30 }, exerciseId: 3 },
        { id: 'd', type: 'repeat', times: 2, steps: [{ id: 'e', type: 'block', kind: 'work', measure: { by: 'reps', reps: 5 }, exerciseId: 7 }] },
      ] },
      { id: 'f', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 300 } },
    ]
    expect(exerciseIdsIn(steps)).toEqual([7, 3])
  })
})

describe('assignments_created e-mail', () => {
  it('lists every date as a calendar day and the note', () => {
    const mail = renderEmail('assignments_created', { athleteName: 'Wren', coachName: 'Idris', teamName: 'Larchford', title: 'Hill reps', dates: ['2027-03-28', '2027-03-23'], note: 'Easy descents', url: 'http://x/today' })
    expect(mail.subject).toBe('Planned for you: Hill reps (2 sessions)')
    expect(mail.text).toContain('- Sun 28 Mar 2027')
    expect(mail.text).toContain('- Tue 23 Mar 2027')
    expect(mail.text).toContain('Easy descents')
    expect(mail.html).not.toContain('<script')
  })
})
