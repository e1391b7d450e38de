import { z } from 'zod'
import { formatDuration } from '../utils/pace'
import { buildTimeline, segmentCountOf } from '../utils/timeline'
import { blockKinds, paceZones, type BlockKind, type PaceZone } from '../utils/vocabulary'

// The routine step tree. One schema serves the builder's forms and the server's checks.

export const MAX_STEP_SECONDS = 6 * 3600
export const MAX_ROUTINE_SECONDS = 12 * 3600
export const MAX_REPEAT = 100
export const MAX_NESTING = 3
export const MAX_STEPS = 200
// A guard against repeats of repeats multiplying into a timeline no session could hold.
export const MAX_SEGMENTS = 10_000

export { blockKinds, paceZones, type BlockKind, type PaceZone }

export const measureSchema = z.discriminatedUnion('by', [
  z.object({ by: z.literal('time'), seconds: z.number().positive('Time must be more than 0 seconds').max(MAX_STEP_SECONDS, 'A step can last at most 6 hours') }),
  z.object({ by: z.literal('distance'), meters: z.number().positive('Distance must be more than 0 m').max(100_000, 'A step can cover at most 100 km') }),
  z.object({ by: z.literal('reps'), reps: z.number().int('Reps must be a whole number').positive('Reps must be at least 1').max(1000, 'At most 1,000 reps in a step') }),
])

export const targetSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('pace'), zone: z.enum(paceZones.values) }),
  z.object({ type: z.literal('effort'), rpe: z.number().min(0, 'RPE runs from 0 to 10').max(10, 'RPE runs from 0 to 10') }),
  z.object({ type: z.literal('load'), kg: z.number().positive('Load must be more than 0 kg').max(500, 'Load must be at most 500 kg') }),
  // %1RM stops at 100: a target above the athlete's one-rep max is not a set anyone should be given.
  z.object({ type: z.literal('percent1rm'), percent: z.number().positive('Percent must be more than 0').max(100, 'Percent of 1RM is at most 100') }),
])

export type Measure = z.infer<typeof measureSchema>
export type Target = z.infer<typeof targetSchema>

const stepId = z.string().min(1, 'Every step needs an id').max(64, 'Step ids are at most 64 characters')
const note = z.string().max(500, 'Notes are at most 500 characters')
const exerciseId = z.number().int().positive('Pick an exercise')

export const blockStepSchema = z.object({
  id: stepId,
  type: z.literal('block'),
  kind: z.enum(blockKinds.values),
  measure: measureSchema,
  exerciseId: exerciseId.optional(),
  target: targetSchema.optional(),
  grade: z.number().min(-0.45, 'Grade must be between -45 % and +45 %').max(0.45, 'Grade must be between -45 % and +45 %').optional(),
  note: note.optional(),
})

export const setsStepSchema = z.object({
  id: stepId,
  type: z.literal('sets'),
  exerciseId,
  sets: z.number().int('Sets must be a whole number').positive('At least 1 set').max(50, 'At most 50 sets'),
  perSet: measureSchema,
  restSeconds: z.number().min(0, 'Rest cannot be negative').max(3600, 'Rest between sets is at most 1 hour'),
  target: targetSchema.optional(),
  note: note.optional(),
})

export type BlockStep = z.infer<typeof blockStepSchema>
export type SetsStep = z.infer<typeof setsStepSchema>
export interface RepeatStep {
  id: string
  type: 'repeat'
  times: number
  skipLastRecovery?: boolean
  steps: RoutineStep[]
}
export type RoutineStep = BlockStep | SetsStep | RepeatStep

export const repeatStepSchema: z.ZodType<RepeatStep> = z.object({
  id: stepId,
  type: z.literal('repeat'),
  times: z.number().int('Repeats must be a whole number').positive('Repeat at least once').max(MAX_REPEAT, `Repeat at most ${MAX_REPEAT} times`),
  skipLastRecovery: z.boolean().optional(),
  get steps() {
    return z.array(routineStepSchema).min(1, 'A repeat needs at least one step inside')
  },
})

export const routineStepSchema: z.ZodType<RoutineStep> = z.union([blockStepSchema, setsStepSchema, repeatStepSchema])

export const routineStepsSchema = z.array(routineStepSchema).superRefine((steps, ctx) => {
  // Zod runs this even when a step failed its own checks; only time a routine whose steps all passed.
  const stepsAreValid = ctx.issues.length === 0
  const firstPathOfId = new Map<string, string>()
  let stepCount = 0
  const walk = (list: readonly RoutineStep[], parentPath: (string | number)[], depth: number) => {
    list.forEach((step, index) => {
      if (typeof step !== 'object' || step === null) {
        return
      }
      const path = [...parentPath, index]
      stepCount += 1
      if (stepCount === MAX_STEPS + 1) {
        ctx.addIssue({ code: 'custom', path, message: `A routine can have at most ${MAX_STEPS} steps, counting the steps inside repeats` })
      }
      const firstPath = firstPathOfId.get(step.id)
      if (firstPath !== undefined) {
        ctx.addIssue({ code: 'custom', path: [...path, 'id'], message: `Step id "${step.id}" is already used by step ${firstPath}` })
      }
      else if (typeof step.id === 'string') {
        firstPathOfId.set(step.id, path.join('.'))
      }
      if (step.type === 'repeat') {
        if (depth + 1 === MAX_NESTING + 1) {
          ctx.addIssue({ code: 'custom', path, message: `Repeats can be nested at most ${MAX_NESTING} deep` })
        }
        if (Array.isArray(step.steps)) {
          walk(step.steps, [...path, 'steps'], depth + 1)
        }
      }
    })
  }
  walk(steps, [], 0)
  if (!stepsAreValid) {
    return
  }

  let segmentCount = 0
  for (const [index, step] of steps.entries()) {
    segmentCount += segmentCountOf(step)
    if (segmentCount > MAX_SEGMENTS) {
      ctx.addIssue({ code: 'custom', path: [index], message: `This routine expands to more than ${MAX_SEGMENTS.toLocaleString('en')} intervals; use fewer repeats` })
      return
    }
  }
  const { segments, totals } = buildTimeline(steps)
  if (totals.durationS > MAX_ROUTINE_SECONDS) {
    const crossing = segments.find(segment => segment.startS + segment.durationS > MAX_ROUTINE_SECONDS)!
    ctx.addIssue({
      code: 'custom',
      path: crossing.path.slice(0, 1),
      message: `A routine can last at most ${MAX_ROUTINE_SECONDS / 3600} hours; this one takes about ${formatDuration(totals.durationS)}`,
    })
  }
})
