import { z } from 'zod'
import { idParam, isoDateSchema, planDateSchema } from './common'
import { daysBetween, isCalendarDay, MAX_PLAN_WEEKS } from '../utils/dates'

export const MAX_BATCH_ATHLETES = 200
export const MAX_BATCH_DATES = 7 * MAX_PLAN_WEEKS
export const MAX_NOTE = 1000

const id = z.number({ error: 'Pick one' }).int().positive('Pick one')
const note = z.string().trim().max(MAX_NOTE, `Notes are at most ${MAX_NOTE} characters`)

export const seriesSchema = z.object({
  startDate: planDateSchema,
  weeks: z.number({ error: 'Give a number of weeks' }).int('Weeks must be a whole number').min(1, 'At least 1 week').max(MAX_PLAN_WEEKS, `A block is at most ${MAX_PLAN_WEEKS} weeks`),
  weekdays: z.array(z.number().int().min(1, 'Weekdays run 1 (Monday) to 7 (Sunday)').max(7, 'Weekdays run 1 (Monday) to 7 (Sunday)'))
    .min(1, 'Choose at least one weekday')
    .max(7)
    .refine(days => new Set(days).size === days.length, 'Each weekday once'),
})

export const assignSchema = z.object({
  routineId: id,
  athleteIds: z.array(id).max(MAX_BATCH_ATHLETES, `At most ${MAX_BATCH_ATHLETES} athletes at once`).optional(),
  squadId: id.optional(),
  dates: z.array(planDateSchema).min(1, 'Add at least one date').max(MAX_BATCH_DATES, `At most ${MAX_BATCH_DATES} dates at once`).optional(),
  series: seriesSchema.optional(),
  note: note.default(''),
  /** A line for one athlete, added under the shared note. Keys are athlete ids. */
  athleteNotes: z.record(z.string().regex(/^\d+$/, 'Keys are athlete ids'), note).optional(),
  /** Sessions the athlete already has on that day with the same routine are skipped unless this is true. */
  confirmDuplicates: z.boolean({ error: 'Choose true or false' }).default(false),
  /** A fresh value per intended batch: sending the same key again returns the first answer, planning nothing new. */
  idempotencyKey: z.string().trim().min(8, 'Use at least 8 characters').max(100, 'Use at most 100 characters').regex(/^[\w-]+$/, 'Letters, digits, - and _ only').optional(),
}).superRefine((value, ctx) => {
  if (!value.athleteIds?.length && !value.squadId) {
    ctx.addIssue({ code: 'custom', path: ['athleteIds'], message: 'Choose athletes or a squad' })
  }
  if (!value.dates && !value.series) {
    ctx.addIssue({ code: 'custom', path: ['dates'], message: 'Choose dates or a weekly repeat' })
  }
  if (value.dates && value.series) {
    ctx.addIssue({ code: 'custom', path: ['series'], message: 'Choose dates or a weekly repeat, not both' })
  }
  if (value.dates?.length && value.dates.every(isCalendarDay)) {
    const sorted = [...value.dates].sort()
    if (daysBetween(sorted[0]!, sorted.at(-1)!) >= MAX_PLAN_WEEKS * 7) {
      ctx.addIssue({ code: 'custom', path: ['dates'], message: `The dates span more than ${MAX_PLAN_WEEKS} weeks` })
    }
  }
})
export type AssignInput = z.input<typeof assignSchema>

export const assignmentRangeSchema = z.object({
  from: isoDateSchema,
  to: isoDateSchema,
  athleteId: idParam.optional(),
  squadId: idParam.optional(),
}).superRefine((value, ctx) => {
  if (!isCalendarDay(value.from) || !isCalendarDay(value.to)) return
  const span = daysBetween(value.from, value.to)
  if (span < 0) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end comes before the start' })
  else if (span >= MAX_PLAN_WEEKS * 7) ctx.addIssue({ code: 'custom', path: ['to'], message: `Ask for at most ${MAX_PLAN_WEEKS} weeks at once` })
})

export const myAssignmentRangeSchema = z.object({
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
  // Without `from`: also return the last N days, so missed sessions can still be done or seen.
  missedDays: z.coerce.number().int('Use a whole number of days').min(0, 'At least 0 days').max(14, 'At most 14 days').optional(),
}).superRefine((value, ctx) => {
  if (!value.from || !value.to || !isCalendarDay(value.from) || !isCalendarDay(value.to)) return
  const span = daysBetween(value.from, value.to)
  if (span < 0) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end comes before the start' })
  else if (span >= MAX_PLAN_WEEKS * 7) ctx.addIssue({ code: 'custom', path: ['to'], message: `Ask for at most ${MAX_PLAN_WEEKS} weeks at once` })
})

export const assignmentPatchSchema = z.object({
  date: planDateSchema.optional(),
  note: note.optional(),
  /** Hands the session to another athlete of the team (the planner grid's drag between rows). */
  athleteId: id.optional(),
}).refine(value => value.date !== undefined || value.note !== undefined || value.athleteId !== undefined, { message: 'Change the date, the athlete or the note', path: ['date'] })

export const restOfSeriesQuerySchema = z.object({
  /** `all`: every athlete in the series; otherwise only this assignment's athlete. */
  who: z.enum(['athlete', 'all'], { error: 'Use athlete or all' }).default('athlete'),
})

export const refreshRoutineSchema = z.object({
  routineId: id,
})

export const notificationsSchema = z.object({
  notifyByEmail: z.boolean({ error: 'Choose on or off' }),
})
