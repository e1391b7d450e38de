import type { BodyArea, ExerciseCaution } from '../types/domain'

export interface InjuryNoteLike {
  bodyArea: string
  status: string
  note?: string
}

export interface MatchedCaution extends ExerciseCaution {
  exerciseId: number
  exerciseName: string
  /** The athlete's active injury areas this caution concerns; empty when it concerns none of them. */
  matchedAreas: BodyArea[]
}

/** Every caution of the given exercises, marking those that concern the athlete's active injury areas. */
export function matchCautions(
  exercises: { id: number, name: string, cautions: ExerciseCaution[] }[],
  injuryNotes: InjuryNoteLike[],
): MatchedCaution[] {
  const active = new Set(injuryNotes.filter(note => note.status === 'active').map(note => note.bodyArea))
  return exercises.flatMap(exercise => exercise.cautions.map(caution => ({
    ...caution,
    exerciseId: exercise.id,
    exerciseName: exercise.name,
    matchedAreas: caution.bodyAreas.filter(area => active.has(area)),
  })))
    .sort((a, b) => b.matchedAreas.length - a.matchedAreas.length)
}

// The usual cautions for each kind of work (common practice, written in our own words).
const general: Record<string, string[]> = {
  any: [
    'Warm up first: 10 minutes of easy running or mobility before hard efforts.',
    'Stop if you feel sharp pain, or pain that grows as you go, and tell your coach.',
    'If you are injured, returning from injury, pregnant or have a medical condition, get clearance from a licensed clinician first.',
  ],
  strength: ['Lift a load you can control for every rep; leave heavy singles to supervised sessions.', 'Keep a neutral back when lifting from the floor.'],
  hill: ['Walk or jog down gently: downhill running loads the knees and shins.', 'Choose a surface with good grip and watch for traffic on roads.'],
  hills: ['Walk or jog down gently: downhill running loads the knees and shins.', 'Choose a surface with good grip and watch for traffic on roads.'],
  plyometric: ['Land softly and quietly; stop when contacts get heavy or sloppy.', 'Build jump volume gradually, especially after time off.'],
  drill: ['Drills are for rhythm, not speed: stay relaxed and tall.'],
  drills: ['Drills are for rhythm, not speed: stay relaxed and tall.'],
  stride: ['Strides build to fast but relaxed running, never a flat-out sprint.'],
}

export function generalCautions(categories: string[]): string[] {
  return [...new Set(['any', ...categories].flatMap(category => general[category] ?? []))]
}
