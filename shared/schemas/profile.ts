import { z } from 'zod'
import { bodyAreas, injuryStatuses } from '../utils/vocabulary'
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
  /** A parent or guardian to reach: name and phone or e-mail, asked of athletes under 18. */
  guardianContact: z.string({ error: 'Write the contact as text' }).trim().max(200, 'At most 200 characters').optional(),
}).refine(value => value.hrMax == null || value.hrRest == null || value.hrRest < value.hrMax, { message: 'Resting HR must be below HRmax', path: ['hrRest'] })

export const injuryNoteSchema = z.object({
  bodyArea: z.enum(bodyAreas.values, { error: 'Pick a body area from the list' }),
  note: z.string().trim().max(500, 'Notes are at most 500 characters').default(''),
  since: isoDateSchema.nullable().optional(),
  status: z.enum(injuryStatuses.values).default('active'),
})

export const injuryNotePatchSchema = z.strictObject({
  bodyArea: z.enum(bodyAreas.values, { error: 'Pick a body area from the list' }).optional(),
  note: z.string().trim().max(500, 'Notes are at most 500 characters').optional(),
  since: isoDateSchema.nullable().optional(),
  status: z.enum(injuryStatuses.values, { error: 'Status is active or resolved' }).optional(),
}, { error: issue => issue.code === 'unrecognized_keys' ? `Unknown field: ${issue.keys.join(', ')}` : undefined })
  .refine(value => Object.values(value).some(field => field !== undefined), 'Send at least one of bodyArea, note, since or status')

export type ProfilePatch = z.infer<typeof profilePatchSchema>

// Number inputs hand over numbers, typed text a string: both are read as text here.
const optionalNumberText = (label: string) => z.union([z.string().max(12), z.number()]).transform(value => String(value).trim()).refine(value => value === '' || Number.isFinite(Number(value)), `${label} must be a number`)

/** The profile page's form: text fields as typed, checked here and converted to a `profilePatchSchema` body. */
export const profileFormSchema = z.object({
  benchmarkDistanceM: optionalNumberText('Distance').refine(value => value === '' || (Number(value) >= 400 && Number(value) <= 250_000), 'Benchmark races are 400 m to 250 km'),
  benchmarkTime: z.string().trim().max(12).refine(value => value === '' || /^\d{1,3}(:\d{2}){0,2}(\.\d+)?$/.test(value), 'Write the time as h:mm:ss or mm:ss, e.g. 40:00'),
  benchmarkDate: z.union([z.literal(''), isoDateSchema]),
  birthYear: optionalNumberText('Year').refine(value => value === '' || (Number.isInteger(Number(value)) && Number(value) >= thisYear - 100 && Number(value) <= thisYear - 8), 'Enter a year within the last 100 years'),
  hrMax: optionalNumberText('HRmax').refine(value => value === '' || (Number(value) >= 120 && Number(value) <= 230), 'HRmax is between 120 and 230 bpm'),
  hrRest: optionalNumberText('Resting HR').refine(value => value === '' || (Number(value) >= 25 && Number(value) <= 120), 'Resting HR is between 25 and 120 bpm'),
  units: z.enum(['km', 'mi']),
  goal: z.string().trim().max(200, 'Goals are at most 200 characters'),
  guardianContact: z.string().trim().max(200, 'At most 200 characters'),
}).refine(value => (value.benchmarkDistanceM === '') === (value.benchmarkTime === ''), { message: 'Give both the distance and the time of the race', path: ['benchmarkTime'] })
