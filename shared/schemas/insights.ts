import { painFlagStatuses } from '../utils/vocabulary'
import { z } from 'zod'
import { idParam, isoDateSchema } from './common'

export const teamSortKeys = ['name', 'compliance7', 'compliance28', 'lastSession', 'weekLoad', 'acwrRolling', 'acwrEwma', 'openPainFlags'] as const
export type TeamSortKey = typeof teamSortKeys[number]

const sortValues = teamSortKeys.flatMap(key => [key, `-${key}`]) as [string, ...string[]]

/** `sort=weekLoad` ascending, `sort=-weekLoad` descending; athletes without a value always come last. */
export const teamInsightsQuerySchema = z.object({
  squadId: idParam.optional(),
  sort: z.enum(sortValues, { error: `Sort by one of ${teamSortKeys.join(', ')} (prefix - for descending)` }).default('name'),
  page: z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').min(1, 'Pages start at 1').max(10_000, 'Page is too large').default(1),
  pageSize: z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').min(1, 'At least 1 row').max(100, 'At most 100 rows a page').default(25),
})

export const athleteInsightsQuerySchema = z.object({
  weeks: z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').min(4, 'At least 4 weeks').max(52, 'At most 52 weeks').default(12),
})

const painFlagStatusFilters = [...painFlagStatuses.values, 'all'] as const
export const painFlagsQuerySchema = z.object({
  status: z.enum(painFlagStatusFilters, { error: 'Status is open, acknowledged or all' }).default('open'),
  athleteId: idParam.optional(),
})

export const acknowledgePainFlagSchema = z.object({
  reply: z.string({ error: 'The reply must be text' }).trim().max(1000, 'Keep the reply under 1000 characters').optional(),
})

export const exportKinds = ['sessions', 'weeks'] as const
export const exportLogsQuerySchema = z.object({
  athleteId: idParam.optional(),
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
  kind: z.enum(exportKinds, { error: 'Kind is sessions or weeks' }).default('sessions'),
}).refine(query => !query.from || !query.to || query.from <= query.to, { message: 'The start date must be on or before the end date', path: ['from'] })
