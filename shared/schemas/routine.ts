import { z } from 'zod'
import { routineCategories, type RoutineCategory } from '../utils/vocabulary'
import { routineStepsSchema } from './routine-steps'

export { routineCategories, type RoutineCategory }

export const routineMetaSchema = z.object({
  title: z.string({ error: 'Give the routine a title' }).trim().min(1, 'Give the routine a title').max(120, 'Titles are at most 120 characters'),
  category: z.enum(routineCategories.values, { error: 'Pick a category' }),
  description: z.string().trim().max(2000, 'The description is at most 2,000 characters').default(''),
})

export const routineInputSchema = routineMetaSchema.extend({ steps: routineStepsSchema })

export const routineUpdateSchema = routineInputSchema.extend({
  version: z.number({ error: 'Send the version you edited' }).int().positive('Send the version you edited'),
})

export const routineListQuerySchema = z.object({
  q: z.string().trim().max(100, 'Search is at most 100 characters').optional(),
  category: z.enum(routineCategories.values, { error: 'Unknown category' }).optional().or(z.literal('').transform(() => undefined)),
  archived: z.enum(['true', 'false']).optional().transform(value => value === 'true'),
})

export const routineArchiveSchema = z.object({ archived: z.boolean().default(true) })

export const routineDuplicateSchema = z.object({
  title: z.string().trim().min(1, 'Give the copy a title').max(120, 'Titles are at most 120 characters').optional(),
})

export const previewQuerySchema = z.object({
  athleteId: z.coerce.number({ error: 'Pick an athlete' }).int().positive('Pick an athlete'),
})

export type RoutineInput = z.infer<typeof routineInputSchema>
