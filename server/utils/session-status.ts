import type { AssignmentSnapshot } from '#shared/types/domain'
import { planSession } from '#shared/utils/session-plan'

/** What a session stores at its start: each loggable segment's key and exercise. */
export function segmentKeysOf(snapshot: AssignmentSnapshot) {
  return loggableKeys(snapshot).map(({ key, exerciseId }) => ({ key, exerciseId: exerciseId ?? null }))
}

/** The loggable segments' keys (step:round:set) of a snapshot: what "done" means for an assignment. */
export function loggableKeys(snapshot: AssignmentSnapshot) {
  return planSession(snapshot, { paces: null, estimatedMaxKg: {}, injuryNotes: [] }).segments
    .filter(segment => segment.loggable)
    .map(segment => ({ key: segment.key, stepId: segment.stepId, exerciseId: segment.exerciseId, set: segment.set, round: segment.round }))
}
