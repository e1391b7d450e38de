import { z } from 'zod'

/** An IANA time zone name the runtime knows (Europe/London, America/Denver, UTC). */
export const timeZoneSchema = z.string({ error: 'Choose a time zone' }).trim().min(1, 'Choose a time zone').max(64, 'Choose a time zone').refine((value) => {
  try {
    new Intl.DateTimeFormat('en', { timeZone: value })
    return true
  }
  catch {
    return false
  }
}, 'Not a time zone this app knows; use a name like Europe/London')

const teamName = z.string({ error: 'Team name is required' }).trim().min(2, 'Team name needs at least 2 characters').max(100, 'Team name is at most 100 characters')

/**
 * How long athletes' form-review clips are kept before the sweep deletes them. At least a week, so a
 * clip is not gone before a coach has looked; at most two years, so personal video does not pile up.
 */
export const REVIEW_RETENTION_DAYS = { min: 7, max: 730 } as const
const reviewRetentionDays = z.number({ error: 'Give a number of days' }).int('Give a whole number of days')
  .min(REVIEW_RETENTION_DAYS.min, `Keep clips at least ${REVIEW_RETENTION_DAYS.min} days`)
  .max(REVIEW_RETENTION_DAYS.max, `Keep clips at most ${REVIEW_RETENTION_DAYS.max} days`)

export const teamSettingsSchema = z.object({
  name: teamName.optional(),
  // Free text: local numbers differ in shape; empty clears it.
  emergencyNumber: z.string().trim().max(40, 'At most 40 characters').regex(/^[\d\s+()\-.]*$/, 'Use digits, spaces and + ( ) - only').nullable().optional()
    .transform(value => value === '' ? null : value),
  timezone: timeZoneSchema.optional(),
  reviewRetentionDays: reviewRetentionDays.optional(),
}).refine(value => value.name !== undefined || value.emergencyNumber !== undefined || value.timezone !== undefined || value.reviewRetentionDays !== undefined, { message: 'Change the name, emergency number, time zone or how long review clips are kept', path: ['name'] })

export const deleteTeamSchema = z.object({
  confirmName: z.string({ error: 'Type the team\'s name to confirm' }).trim().min(1, 'Type the team\'s name to confirm').max(100),
})

export const memberRoleSchema = z.object({
  role: z.enum(['head_coach', 'coach'], { error: 'Role must be head coach or coach' }),
})

export const removeMemberQuerySchema = z.object({
  /** Clears the athlete's notes and injury notes from the team's records; the numbers stay. */
  anonymise: z.enum(['true', 'false'], { error: 'Use true or false' }).default('false').transform(value => value === 'true'),
})

export const switchTeamSchema = z.object({
  teamId: z.number({ error: 'Choose a team' }).int().positive('Choose a team'),
})

export const checklistSchema = z.object({
  dismissed: z.boolean({ error: 'Choose true or false' }),
})

/** An athlete's first-visit answers; every part may be left out, and `skip` records that they chose not to answer. */
export const welcomeSchema = z.object({
  skip: z.boolean().default(false),
  benchmarkDistanceM: z.number({ error: 'Distance must be a number' }).min(400, 'Benchmark races are 400 m or longer').max(250_000, 'Benchmark races are at most 250 km').optional(),
  benchmarkTimeS: z.number({ error: 'Time must be a number' }).min(30, 'That time is too short').max(48 * 3600, 'That time is longer than 48 hours').optional(),
  benchmarkDate: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-15').optional(),
  units: z.enum(['km', 'mi'], { error: 'Pick km or mi' }).optional(),
  timezone: timeZoneSchema.optional(),
  injury: z.object({
    bodyArea: z.string({ error: 'Pick a body area' }).min(1, 'Pick a body area').max(40),
    note: z.string().trim().max(500, 'Notes are at most 500 characters').default(''),
  }).optional(),
}).refine(value => (value.benchmarkDistanceM === undefined) === (value.benchmarkTimeS === undefined), { message: 'Give both the distance and the time', path: ['benchmarkTimeS'] })
