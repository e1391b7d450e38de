import { z } from 'zod'

/**
 * A database id from a URL path, parsed strictly: digits only, so `0x10`, `1e1`, ` 1` or `1.0` are
 * refused rather than read as 16, 10 or 1. Every route's `[id]` goes through this one schema.
 */
export const idParam = z.string({ error: 'Must be a number' })
  .regex(/^\d{1,15}$/, 'Must be a positive whole number')
  .transform(Number)
  .pipe(z.number().int().positive('Must be a positive id'))
export const idParamsSchema = z.object({ id: idParam })
/** A database id sent as a number in a JSON body. */
export const bodyId = z.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be a positive id').max(Number.MAX_SAFE_INTEGER)

export const emailSchema = z.string({ error: 'E-mail is required' }).trim().toLowerCase().max(254, 'E-mail is too long').email('Enter a valid e-mail address')
export const passwordSchema = z.string({ error: 'Password is required' }).min(10, 'Use at least 10 characters').max(200, 'Use at most 200 characters')
export const personNameSchema = z.string({ error: 'Name is required' }).trim().min(1, 'Name is required').max(100, 'Name is at most 100 characters')

/** A real calendar date, `YYYY-MM-DD`. */
export const isoDateSchema = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-15').refine((value) => {
  const date = new Date(`${value}T00:00:00Z`)
  return !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === value
}, 'Not a real date')

/** How far from today a plan date may lie; keeps dates that calendars and date maths can handle. */
export const PLAN_WINDOW_YEARS = 5

/** A calendar date within `PLAN_WINDOW_YEARS` of today (UTC), for anything put on the plan. */
export const planDateSchema = isoDateSchema.refine((value) => {
  const year = new Date().getUTCFullYear()
  const today = new Date().toISOString().slice(0, 10)
  return value >= `${year - PLAN_WINDOW_YEARS}${today.slice(4)}` && value <= `${year + PLAN_WINDOW_YEARS}${today.slice(4)}`
}, `Pick a date within ${PLAN_WINDOW_YEARS} years of today`)
