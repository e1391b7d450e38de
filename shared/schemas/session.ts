import { z } from 'zod'
import { bodyAreas, effortScale, painScale } from '../utils/vocabulary'
import { isoDateSchema } from './common'

export const MAX_REPS = 1000
export const MAX_KG = 500
export const MAX_SECONDS = 86_400
export const MAX_METERS = 100_000
export const EDIT_WINDOW_DAYS = 7

const key = z.string({ error: 'A key is required' }).trim().min(8, 'Keys are at least 8 characters').max(100, 'Keys are at most 100 characters').regex(/^[\w:.-]+$/, 'Keys use letters, digits, - _ : . only')
const rpe = z.number({ error: 'RPE must be a number' }).min(0, 'RPE runs from 0 to 10').max(10, 'RPE runs from 0 to 10')

export const startSessionSchema = z.object({
  clientId: key,
  /** When the athlete pressed start (epoch ms), which may be earlier than the request when it was queued offline. */
  startedAt: z.number().int().positive().optional(),
})

export const entryValuesSchema = z.object({
  reps: z.number({ error: 'Reps must be a number' }).int('Reps must be a whole number').min(0, 'Reps cannot be negative').max(MAX_REPS, `At most ${MAX_REPS.toLocaleString('en')} reps`).nullable().optional(),
  kg: z.number({ error: 'Load must be a number' }).min(0, 'Load cannot be negative').max(MAX_KG, `Load is at most ${MAX_KG} kg`).nullable().optional(),
  seconds: z.number({ error: 'Time must be a number' }).min(0, 'Time cannot be negative').max(MAX_SECONDS, 'Time cannot be longer than a day').nullable().optional(),
  meters: z.number({ error: 'Distance must be a number' }).min(0, 'Distance cannot be negative').max(MAX_METERS, 'Distance is at most 100 km').nullable().optional(),
  rpe: rpe.nullable().optional(),
})

export const entrySchema = entryValuesSchema.extend({
  idempotencyKey: key,
  stepId: z.string({ error: 'Which step?' }).min(1, 'Which step?').max(64, 'Step ids are at most 64 characters'),
  set: z.number().int().min(1).max(50).optional(),
  round: z.number().int().min(1).max(1_000_000).optional(),
})

export const entryPatchSchema = entryValuesSchema.refine(value => Object.keys(value).length > 0, 'Change at least one value')

export const finishSessionSchema = z.object({
  sessionRpe: rpe,
  pain: z.number({ error: 'Pain must be a number' }).int('Pain is a whole number from 0 to 10').min(0, 'Pain runs from 0 to 10').max(10, 'Pain runs from 0 to 10').optional(),
  painArea: z.enum(bodyAreas.values, { error: 'Pick a body area from the list' }).optional(),
  /** The pain came on suddenly or is sharp: shows the urgent guidance whatever the score. */
  sudden: z.boolean({ error: 'Say yes or no' }).optional(),
  note: z.string().trim().max(2000, 'Notes are at most 2,000 characters').optional(),
  /** Active time without pauses, as the player measured it. */
  durationS: z.number().min(0, 'Time cannot be negative').max(MAX_SECONDS, 'A session cannot be longer than a day').optional(),
}).refine(value => !value.pain || value.painArea, { message: 'Say where it hurts', path: ['painArea'] })

export const logbookQuerySchema = z.object({
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
}).refine(value => !value.from || !value.to || value.from <= value.to, { message: 'The start date must be before the end date', path: ['to'] })

export type EntryInput = z.infer<typeof entrySchema>
export type FinishInput = z.infer<typeof finishSessionSchema>

/** The one effort scale (shared/utils/vocabulary.ts), by point 0–10. */
export const effortAnchors: readonly string[] = effortScale
export const painAnchors: Record<number, string> = painScale

/** Pain at or above this raises a flag for the coach. */
export const PAIN_FLAG_THRESHOLD = 4
