import type { AssignmentSnapshot } from '#shared/types/domain'
import { planSession } from '#shared/utils/session-plan'

/** The loggable segments' keys (step:round:set) of a snapshot: what "done" means for an assignment. */
export function loggableKeys(snapshot: AssignmentSnapshot) {
  return planSession(snapshot, { paces: null, estimatedMaxKg: {}, injuryNotes: [] }).segments
    .filter(segment => segment.loggable)
    .map(segment => ({ key: segment.key, stepId: segment.stepId, exerciseId: segment.exerciseId, set: segment.set, round: segment.round }))
}
