import { z } from 'zod'

export const idParam = z.coerce.number({ error: 'Must be a number' }).int().positive('Must be a positive id')
export const idParamsSchema = z.object({ id: idParam })

export const emailSchema = z.string({ error: 'E-mail is required' }).trim().toLowerCase().max(254, 'E-mail is too long').email('Enter a valid e-mail address')
export const passwordSchema = z.string({ error: 'Password is required' }).min(10, 'Use at least 10 characters').max(200, 'Use at most 200 characters')
export const personNameSchema = z.string({ error: 'Name is required' }).trim().min(1, 'Name is required').max(100, 'Name is at most 100 characters')

/** A real calendar date, `YYYY-MM-DD`. */
export const isoDateSchema = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-15').refine((value) => {
  const date = new Date(`${value}T00:00:00Z`)
  return !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === value
}, 'Not a real date')
