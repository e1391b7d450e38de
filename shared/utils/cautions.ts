import type { ExerciseCaution } from '../types/domain'
import type { RoutineStep, Target } from '../schemas/routine-steps'
import type { BodyArea } from './vocabulary'

// Every caution Switchback shows is chosen here: the exercise's own cautions, the cautions that follow
// from the step itself (a climb, a descent, a sprint, a jump, a heavy lift), and the general ones.
// The builder preview, the briefing and the player all call these functions; none re-implements them.

export interface InjuryNoteLike {
  bodyArea: string
  status: string
  note?: string
}

export interface MatchedCaution extends ExerciseCaution {
  /** The exercise the caution belongs to; null for a caution derived from the step itself. */
  exerciseId: number | null
  /** The exercise's name, or for a step-derived caution the kind of work ("Uphill efforts"). */
  exerciseName: string
  source: 'exercise' | 'step'
  /** The athlete's active injury areas this caution concerns; empty when it concerns none of them. */
  matchedAreas: BodyArea[]
}

export const HEAVY_PERCENT_1RM = 85
export const MAX_PERCENT_1RM = 100

// Which body areas a kind of step loads. Common practice, no published source: these are the
// areas coaches and physiotherapists usually name for each kind of work, written in our own words.
export const stepCautionTable = {
  uphill: {
    label: 'Uphill efforts',
    bodyAreas: ['achilles', 'calf'],
    text: 'Climbing loads the Achilles and calves: keep the stride short, and stop if either tightens sharply.',
  },
  downhill: {
    label: 'Downhill running',
    bodyAreas: ['knee', 'shin', 'quad'],
    text: 'Running downhill loads the knees, shins and thighs: short quick steps, easy pace, walk if it hurts.',
  },
  fast: {
    label: 'Fast strides and sprints',
    bodyAreas: ['hamstring'],
    text: 'Fast running loads the hamstrings: build speed over the first strides and ease off at any pull at the back of the thigh.',
  },
  jumps: {
    label: 'Jumps and bounds',
    bodyAreas: ['achilles', 'knee', 'foot'],
    text: 'Jumps and bounds load the Achilles, knees and feet: land softly, keep contacts few, and stop when landings get heavy.',
  },
  heavy: {
    label: `Heavy lifts (${HEAVY_PERCENT_1RM} % of 1RM or more)`,
    bodyAreas: ['lower_back'],
    text: `Sets at ${HEAVY_PERCENT_1RM} % of 1RM or more load the lower back: they are for supervised sessions with a spotter.`,
  },
} as const satisfies Record<string, { label: string, bodyAreas: readonly BodyArea[], text: string }>

export type StepCautionKey = keyof typeof stepCautionTable
export const stepCautionKeys = Object.keys(stepCautionTable) as StepCautionKey[]

/** What a step is made of, enough to tell which cautions it carries. */
export interface StepFacts {
  kind?: string
  grade?: number | null
  target?: Target | null
  /** The category of the step's exercise, if it names one. */
  exerciseCategory?: string | null
}

/** The step-derived cautions of one step (or one segment of it), in the table's order. */
export function stepCautionsFor(step: StepFacts): StepCautionKey[] {
  const grade = step.grade ?? 0
  const target = step.target ?? undefined
  const category = step.exerciseCategory ?? null
  const working = step.kind === undefined || step.kind === 'work'
  const keys = new Set<StepCautionKey>()
  if (working && (grade > 0 || (category === 'hill' && grade >= 0))) keys.add('uphill')
  if (grade < 0) keys.add('downhill')
  const fastZone = target?.type === 'pace' && (target.zone === 'mile' || target.zone === 'fiveK')
  if (working && (category === 'stride' || (fastZone && grade <= 0))) keys.add('fast')
  if (working && category === 'plyometric') keys.add('jumps')
  if (target?.type === 'percent1rm' && target.percent >= HEAVY_PERCENT_1RM) keys.add('heavy')
  return stepCautionKeys.filter(key => keys.has(key))
}

/** Every step-derived caution a routine carries, once each. */
export function routineStepCautions(steps: readonly RoutineStep[], categoryOf: (exerciseId: number) => string | undefined): StepCautionKey[] {
  const keys = new Set<StepCautionKey>()
  const visit = (list: readonly RoutineStep[]) => {
    for (const step of list) {
      if (step.type === 'repeat') {
        visit(step.steps)
        continue
      }
      const facts: StepFacts = {
        kind: step.type === 'block' ? step.kind : 'work',
        grade: step.type === 'block' ? step.grade : undefined,
        target: step.target,
        exerciseCategory: step.exerciseId ? categoryOf(step.exerciseId) : undefined,
      }
      for (const key of stepCautionsFor(facts)) keys.add(key)
    }
  }
  visit(steps)
  return stepCautionKeys.filter(key => keys.has(key))
}

export function activeAreas(injuryNotes: readonly InjuryNoteLike[]): Set<string> {
  return new Set(injuryNotes.filter(note => note.status === 'active').map(note => note.bodyArea))
}

/** A step-derived caution as a matched caution, so screens list it beside the exercise cautions. */
export function stepCaution(key: StepCautionKey, active: Set<string>): MatchedCaution {
  const entry = stepCautionTable[key]
  return {
    text: entry.text,
    bodyAreas: [...entry.bodyAreas],
    exerciseId: null,
    exerciseName: entry.label,
    source: 'step',
    matchedAreas: entry.bodyAreas.filter(area => active.has(area)),
  }
}

/**
 * Every caution of the given exercises, and of the steps when given, marking those that concern the
 * athlete's active injury areas; those come first.
 */
export function matchCautions(
  exercises: readonly { id: number, name: string, category?: string, cautions: ExerciseCaution[] }[],
  injuryNotes: readonly InjuryNoteLike[],
  steps?: readonly RoutineStep[],
): MatchedCaution[] {
  const active = activeAreas(injuryNotes)
  const fromExercises = exercises.flatMap(exercise => exercise.cautions.map((caution): MatchedCaution => ({
    ...caution,
    exerciseId: exercise.id,
    exerciseName: exercise.name,
    source: 'exercise',
    matchedAreas: caution.bodyAreas.filter(area => active.has(area)),
  })))
  const categories = new Map(exercises.map(exercise => [exercise.id, exercise.category]))
  const fromSteps = steps ? routineStepCautions(steps, id => categories.get(id)).map(key => stepCaution(key, active)) : []
  return [...fromExercises, ...fromSteps].sort((a, b) => b.matchedAreas.length - a.matchedAreas.length)
}

export interface StepCautionLine {
  text: string
  /** The athlete has an active injury note on an area this caution concerns. */
  concernsYou: boolean
}

/**
 * The cautions to show during one step of the player: the exercise's own, then those derived from
 * the step; the ones touching the athlete's injury notes first.
 */
export function cautionsForStep(
  exerciseCautions: readonly ExerciseCaution[],
  stepKeys: readonly StepCautionKey[],
  injuryNotes: readonly InjuryNoteLike[],
): StepCautionLine[] {
  const active = activeAreas(injuryNotes)
  const lines = [
    ...exerciseCautions.map(caution => ({ text: caution.text, concernsYou: caution.bodyAreas.some(area => active.has(area)) })),
    ...stepKeys.map(key => ({ text: stepCautionTable[key].text, concernsYou: stepCautionTable[key].bodyAreas.some(area => active.has(area)) })),
  ]
  return lines.sort((a, b) => Number(b.concernsYou) - Number(a.concernsYou))
}

// The usual cautions for each kind of work (common practice, written in our own words).
// Keyed by exercise and routine category keys alike, so one list serves both.
const always = [
  'Warm up first: 10 minutes of easy running or mobility before hard efforts.',
  'Stop if you feel sharp pain, or pain that grows as you go, and tell your coach.',
  'If you are injured, returning from injury, pregnant or have a medical condition, get clearance from a licensed clinician first.',
]
const hillWords = ['Walk or jog down gently: downhill running loads the knees and shins.', 'Choose a surface with good grip and watch for traffic on roads.']
const drillWords = ['Drills are for rhythm, not speed: stay relaxed and tall.']
const byCategory: Record<string, string[]> = {
  strength: ['Lift a load you can control for every rep; leave heavy singles to supervised sessions.', 'Keep a neutral back when lifting from the floor.'],
  hill: hillWords,
  hills: hillWords,
  plyometric: ['Land softly and quietly; stop when contacts get heavy or sloppy.', 'Build jump volume gradually, especially after time off.'],
  drill: drillWords,
  drills: drillWords,
  stride: ['Strides build to fast but relaxed running, never a flat-out sprint.'],
}

/** The general cautions that every card, briefing and preview keeps in full: never shortened. */
export const alwaysCautions: readonly string[] = always

export function generalCautions(categories: string[]): string[] {
  return [...new Set([...always, ...categories.flatMap(category => byCategory[category] ?? [])])]
}

/** The supervised-session note for heavy sets, or null below the threshold. */
export function heavySetNote(percent: number | null | undefined): string | null {
  return percent != null && percent >= HEAVY_PERCENT_1RM
    ? `Heavy set (${percent} % of 1RM): do it only in a supervised session, with a spotter.`
    : null
}
