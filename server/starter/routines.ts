import type { RoutineStep } from '#shared/schemas/routine-steps'

// Starting points a coach copies and adapts, in our own words. Exercises are found by name in the
// team's library at run time; a template whose exercises are not there yet is left for a later run.

export interface StarterTemplate {
  title: string
  category: 'strength' | 'hills' | 'drills' | 'mixed'
  description: string
  /** Exercises the template cannot do without. */
  needs: string[]
  /** Exercises it names when they exist (drills fall back to a note). */
  uses?: string[]
  steps: (exercise: (name: string) => number | undefined) => RoutineStep[]
}

const easy = { type: 'pace', zone: 'easy' } as const

export const starterTemplates: StarterTemplate[] = [
  {
    title: 'Template: Short hills, 8 × 60 s',
    category: 'hills',
    description: 'Eight one-minute climbs at about 5K effort on a steady 5–8 % road or trail, jogging back down between them. Builds leg strength and running economy with less pounding than flat speed work.',
    needs: [],
    uses: ['One-minute hill climbs'],
    steps: exercise => [
      { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 15 * 60 }, target: easy, note: 'Easy running to the foot of the hill, with a few leg swings at the end.' },
      {
        id: 'climbs',
        type: 'repeat',
        times: 8,
        skipLastRecovery: true,
        steps: [
          { id: 'up', type: 'block', kind: 'work', measure: { by: 'time', seconds: 60 }, target: { type: 'pace', zone: 'fiveK' }, grade: 0.06, exerciseId: exercise('One-minute hill climbs'), note: 'Run tall, drive the arms, keep the effort even to the top.' },
          { id: 'down', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 }, note: 'Jog or walk back down gently; the descent is the recovery.' },
        ],
      },
      { id: 'cool', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 10 * 60 }, target: easy },
    ],
  },
  {
    title: 'Template: Six-station gym circuit',
    category: 'strength',
    description: 'Three rounds of six stations for the legs and trunk, 40 s on each with a short move between. Pick a load that leaves two or three good reps in the tank.',
    needs: ['Goblet squat', 'Romanian deadlift', 'Step-ups', 'Glute bridge', 'Single-leg calf raise', 'Side plank'],
    steps: (exercise) => {
      const station = (id: string, name: string, note: string): RoutineStep[] => [
        { id, type: 'block', kind: 'work', measure: { by: 'time', seconds: 40 }, exerciseId: exercise(name), target: { type: 'effort', rpe: 7 }, note },
        { id: `${id}-move`, type: 'block', kind: 'rest', measure: { by: 'time', seconds: 20 } },
      ]
      return [
        { id: 'warm', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 8 * 60 }, target: { type: 'effort', rpe: 3 }, note: 'Easy bike or rower, then a few bodyweight squats and lunges.' },
        {
          id: 'rounds',
          type: 'repeat',
          times: 3,
          steps: [
            ...station('squat', 'Goblet squat', 'Sit between the heels, chest up.'),
            ...station('hinge', 'Romanian deadlift', 'Push the hips back; the bar stays close to the legs.'),
            ...station('step', 'Step-ups', 'Swap legs halfway through.'),
            ...station('bridge', 'Glute bridge', 'Squeeze at the top for a second.'),
            ...station('calf', 'Single-leg calf raise', 'Slow on the way down; swap legs halfway.'),
            ...station('plank', 'Side plank', 'Twenty seconds on each side.'),
            { id: 'between', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 90 }, note: 'Drink, breathe, reset the stations.' },
          ],
          skipLastRecovery: true,
        },
        { id: 'cool', type: 'block', kind: 'cooldown', measure: { by: 'time', seconds: 5 * 60 }, note: 'Easy walk and gentle stretching.' },
      ]
    },
  },
  {
    title: 'Template: Strides after an easy run',
    category: 'drills',
    description: 'An easy run finished with six relaxed strides on flat grass or a quiet road: fast, smooth running without strain.',
    needs: [],
    uses: ['Strides'],
    steps: exercise => [
      { id: 'run', type: 'block', kind: 'work', measure: { by: 'time', seconds: 30 * 60 }, target: easy, note: 'The easy run itself: conversational pace the whole way.' },
      {
        id: 'strides',
        type: 'repeat',
        times: 6,
        steps: [
          { id: 'stride', type: 'block', kind: 'work', measure: { by: 'distance', meters: 100 }, target: { type: 'pace', zone: 'mile' }, exerciseId: exercise('Strides'), note: 'Build over the first 30 m, hold it smooth, ease off before the end.' },
          { id: 'walk', type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 60 }, note: 'Walk back to the start.' },
        ],
      },
    ],
  },
  {
    title: 'Template: Drills warm-up',
    category: 'drills',
    description: 'A short set of running drills before a session or race: rhythm and posture first, never rushed.',
    needs: [],
    uses: ['A-skips', 'B-skips', 'High knees', 'Butt kicks', 'Carioca'],
    steps: (exercise) => {
      const drill = (id: string, name: string): RoutineStep[] => [
        { id, type: 'block', kind: 'work', measure: { by: 'distance', meters: 20 }, exerciseId: exercise(name), note: exercise(name) ? undefined : name },
        { id: `${id}-back`, type: 'block', kind: 'recovery', measure: { by: 'time', seconds: 30 }, note: 'Walk back.' },
      ]
      return [
        { id: 'jog', type: 'block', kind: 'warmup', measure: { by: 'time', seconds: 10 * 60 }, target: easy },
        {
          id: 'drills',
          type: 'repeat',
          times: 2,
          steps: [...drill('a', 'A-skips'), ...drill('b', 'B-skips'), ...drill('knees', 'High knees'), ...drill('kicks', 'Butt kicks'), ...drill('side', 'Carioca')],
        },
      ]
    },
  },
]
