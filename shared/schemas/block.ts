import { z } from 'zod'
import { idParam, isoDateSchema } from './common'
import { MAX_PLAN_WEEKS } from '../utils/dates'
import { progressionFields, progressionLimits } from '../utils/progression'

export const MAX_BLOCK_ROUTINES = 14
export const MAX_RULES_PER_ROUTINE = 20

const id = z.number({ error: 'Pick one' }).int().positive('Pick one')
const weekNumber = z.number({ error: 'Give a week' }).int('Weeks are whole numbers').min(1, 'Weeks run from 1').max(MAX_PLAN_WEEKS, `A block is at most ${MAX_PLAN_WEEKS} weeks`)
const factor = z.number({ error: 'Give a factor' }).min(0.3, 'Keep at least 30 % of the volume').max(0.95, 'A lighter week keeps at most 95 % of the volume')

export const progressionRuleSchema = z.object({
  stepId: z.string({ error: 'Pick a step' }).min(1, 'Pick a step').max(64),
  field: z.enum(progressionFields.values, { error: 'Pick what changes' }),
  by: z.number({ error: 'Give the change per step' }).min(-1000, 'At most 1,000 per step').max(1000, 'At most 1,000 per step').refine(value => value !== 0, 'A change of 0 changes nothing'),
  mode: z.enum(['add', 'percent']).optional(),
  every: z.number().int('Whole weeks').min(1, 'At least every week').max(MAX_PLAN_WEEKS).optional(),
  cap: z.number().optional(),
}).superRefine((rule, ctx) => {
  const limits = progressionLimits[rule.field]
  if (rule.cap !== undefined && limits && (rule.cap < limits.min || rule.cap > limits.max)) {
    ctx.addIssue({ code: 'custom', path: ['cap'], message: `The cap must be between ${limits.min} and ${limits.max}` })
  }
  if (rule.mode === 'percent' && rule.field !== 'loadKg') {
    ctx.addIssue({ code: 'custom', path: ['mode'], message: 'Only a kg load can grow by a percentage' })
  }
})

export const blockRoutineInputSchema = z.object({
  /** The slot's id when editing a planned block, so its sessions stay linked. */
  id: id.optional(),
  routineId: id,
  weekday: z.number({ error: 'Pick a weekday' }).int().min(1, 'Weekdays run 1 (Monday) to 7 (Sunday)').max(7, 'Weekdays run 1 (Monday) to 7 (Sunday)'),
  rules: z.array(progressionRuleSchema).max(MAX_RULES_PER_ROUTINE, `At most ${MAX_RULES_PER_ROUTINE} changes per routine`).default([]),
  note: z.string().trim().max(500, 'Notes are at most 500 characters').default(''),
})

export const blockInputSchema = z.object({
  name: z.string({ error: 'Give the block a name' }).trim().min(1, 'Give the block a name').max(120, 'Names are at most 120 characters'),
  startDate: isoDateSchema,
  weeks: weekNumber,
  athleteIds: z.array(id).max(200, 'At most 200 athletes').default([]),
  squadIds: z.array(id).max(50, 'At most 50 squads').default([]),
  goalRace: z.object({
    name: z.string({ error: 'Name the race' }).trim().min(1, 'Name the race').max(120, 'At most 120 characters'),
    date: isoDateSchema,
    distanceM: z.number({ error: 'Give the distance' }).positive('Give the distance').max(400_000, 'At most 400 km'),
  }).nullable().default(null),
  lighter: z.object({
    every: z.number().int('Whole weeks').min(2, 'Every 2nd week at the most often').max(MAX_PLAN_WEEKS).optional(),
    weeks: z.array(weekNumber).max(MAX_PLAN_WEEKS).optional(),
    factor,
  }).nullable().default(null),
  taper: z.object({
    weeks: z.number({ error: 'Give the taper\'s weeks' }).int('Whole weeks').min(1, 'A taper is 1 to 3 weeks').max(3, 'A taper is 1 to 3 weeks'),
    factor,
  }).nullable().default(null),
  note: z.string().trim().max(1000, 'Notes are at most 1,000 characters').default(''),
  routines: z.array(blockRoutineInputSchema).min(1, 'Add at least one routine').max(MAX_BLOCK_ROUTINES, `At most ${MAX_BLOCK_ROUTINES} routines in a block`),
}).superRefine((block, ctx) => {
  if (!block.athleteIds.length && !block.squadIds.length) {
    ctx.addIssue({ code: 'custom', path: ['athleteIds'], message: 'Choose athletes or a squad' })
  }
  if (block.taper && block.taper.weeks >= block.weeks) {
    ctx.addIssue({ code: 'custom', path: ['taper', 'weeks'], message: `A taper must be shorter than the block (${block.weeks} week${block.weeks === 1 ? '' : 's'})` })
  }
  if (block.goalRace && block.goalRace.date < block.startDate) {
    ctx.addIssue({ code: 'custom', path: ['goalRace', 'date'], message: 'The goal race is before the block starts' })
  }
  if (block.lighter) {
    if (!block.lighter.every && !block.lighter.weeks?.length) {
      ctx.addIssue({ code: 'custom', path: ['lighter', 'every'], message: 'Choose every how many weeks, or which weeks, are lighter' })
    }
    const late = block.lighter.weeks?.findIndex(week => week > block.weeks) ?? -1
    if (late >= 0) ctx.addIssue({ code: 'custom', path: ['lighter', 'weeks', late], message: `The block has ${block.weeks} weeks` })
  }
})

export type BlockInput = z.infer<typeof blockInputSchema>

export const overrideInputSchema = z.object({
  blockRoutineId: id,
  /** Empty: back to the rules. */
  values: z.array(z.object({
    stepId: z.string().min(1).max(64),
    field: z.enum(progressionFields.values),
    value: z.number({ error: 'Give a number' }),
  }).superRefine((value, ctx) => {
    const limits = progressionLimits[value.field]
    if (limits && (value.value < limits.min || value.value > limits.max)) {
      ctx.addIssue({ code: 'custom', path: ['value'], message: `Between ${limits.min} and ${limits.max}` })
    }
  })).max(MAX_RULES_PER_ROUTINE),
})

export const blockWeekParamsSchema = z.object({ id: idParam, week: z.coerce.number({ error: 'Must be a number' }).int().min(1, 'Weeks run from 1').max(MAX_PLAN_WEEKS, `A block is at most ${MAX_PLAN_WEEKS} weeks`) })

export const plateSettingSchema = z.object({
  plateIncrementKg: z.number({ error: 'Give the smallest load step in kg' }).min(0.25, 'At least 0.25 kg').max(25, 'At most 25 kg'),
})
