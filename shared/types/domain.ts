import type { RoutineStep } from '../schemas/routine-steps'
import type { BodyArea } from '../utils/vocabulary'

// Body areas, roles and the other enums live in the one vocabulary: shared/utils/vocabulary.ts.

export interface ExerciseCaution {
  text: string
  bodyAreas: BodyArea[]
}

/** What an exercise looked like when a routine was assigned: enough to run the session later. */
export interface SnapshotExercise {
  id: number
  name: string
  category: string
  summary: string
  cues: string[]
  equipment: string[]
  cautions: ExerciseCaution[]
}

export interface AssignmentSnapshot {
  title: string
  category: string
  description: string
  steps: RoutineStep[]
  exercises: SnapshotExercise[]
  /** Set when the session comes from a training block: which week, what kind, what changed. */
  block?: SnapshotBlockWeek
}

export interface SnapshotBlockWeek {
  id: number
  name: string
  week: number
  weeks: number
  kind: 'regular' | 'lighter' | 'taper'
  /** From last week's session of the same routine slot, in plain words: "+1 round". */
  changes: string[]
  overridden: boolean
}
