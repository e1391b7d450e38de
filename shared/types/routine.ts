import type { MatchedCaution } from '../utils/cautions'
import type { TrainingPaces } from '../utils/pace'
import type { RoutineStep, Target } from '../schemas/routine-steps'
import type { Timeline } from '../utils/timeline'

export interface ResolvedTarget {
  target: Target
  /** Flat pace for the zone, s/km; easy is a range, the others have fast = slow. */
  pace?: { fast: number, slow: number }
  /** The same effort on the step's gradient (Minetti et al. 2002), s/km. */
  hillPace?: { fast: number, slow: number }
  grade?: number
  /** The athlete's best estimated 1RM for the exercise, and the load the percentage gives. */
  estimatedMaxKg?: number
  loadKg?: number
  /** Why nothing could be filled in, in plain words. */
  missing?: string
}

/** `GET /api/routines/[id]/preview?athleteId=`: the routine with one athlete's numbers and cautions. */
export interface RoutinePreview {
  routine: { id: number, title: string, category: string, version: number, steps: RoutineStep[] }
  athlete: {
    id: number
    name: string
    units: 'km' | 'mi'
    benchmark: { distanceM: number, timeS: number, date: string | null } | null
  }
  paces: TrainingPaces | null
  targets: Record<string, ResolvedTarget>
  timeline: Timeline
  exercises: { id: number, name: string, category: string }[]
  injuryNotes: { bodyArea: string, note: string, since: string | null }[]
  cautions: MatchedCaution[]
  generalCautions: string[]
}
