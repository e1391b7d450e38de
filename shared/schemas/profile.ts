import { z } from 'zod'
import { bodyAreas } from '../types/domain'
import { isoDateSchema } from './common'

const thisYear = new Date().getUTCFullYear()

export const profilePatchSchema = z.object({
  benchmarkDistanceM: z.number({ error: 'Distance must be a number' }).min(400, 'Benchmark races are 400 m or longer').max(250_000, 'Benchmark races are at most 250 km').nullable().optional(),
  benchmarkTimeS: z.number({ error: 'Time must be a number' }).min(30, 'That time is too short').max(48 * 3600, 'That time is longer than 48 hours').nullable().optional(),
  benchmarkDate: isoDateSchema.nullable().optional(),
  birthYear: z.number({ error: 'Year must be a number' }).int('Year is a whole number').min(thisYear - 100, 'Enter a year within the last 100 years').max(thisYear - 8, 'Athletes are at least 8 years old').nullable().optional(),
  hrMax: z.number({ error: 'HRmax must be a number' }).int('Whole beats per minute').min(120, 'HRmax is at least 120 bpm').max(230, 'HRmax is at most 230 bpm').nullable().optional(),
  hrRest: z.number({ error: 'Resting HR must be a number' }).int('Whole beats per minute').min(25, 'Resting HR is at least 25 bpm').max(120, 'Resting HR is at most 120 bpm').nullable().optional(),
  units: z.enum(['km', 'mi'], { error: 'Pick km or mi' }).optional(),
  goal: z.string().trim().max(200, 'Goals are at most 200 characters').optional(),
}).refine(value => value.hrMax == null || value.hrRest == null || value.hrRest < value.hrMax, { message: 'Resting HR must be below HRmax', path: ['hrRest'] })

export const injuryNoteSchema = z.object({
  bodyArea: z.enum(bodyAreas, { error: 'Pick a body area from the list' }),
  note: z.string().trim().max(500, 'Notes are at most 500 characters').default(''),
  since: isoDateSchema.nullable().optional(),
  status: z.enum(['active', 'resolved']).default('active'),
})

export const injuryNotePatchSchema = z.object({
  bodyArea: z.enum(bodyAreas, { error: 'Pick a body area from the list' }).optional(),
  note: z.string().trim().max(500, 'Notes are at most 500 characters').optional(),
  since: isoDateSchema.nullable().optional(),
  status: z.enum(['active', 'resolved'], { error: 'Status is active or resolved' }).optional(),
})

export type ProfilePatch = z.infer<typeof profilePatchSchema>
