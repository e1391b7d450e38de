import { z } from 'zod'
import { bodyAreas, exerciseCategories, type BodyArea, type ExerciseCategory } from '../utils/vocabulary'

// One set of rules for the exercise form and the exercise routes.

export { exerciseCategories, type ExerciseCategory }

export const EXERCISE_LIMITS = {
  name: 120,
  summary: 2000,
  cues: 20,
  cue: 300,
  equipment: 12,
  equipmentItem: 60,
  cautions: 12,
  caution: 500,
} as const

export const CLIP_MAX_BYTES = 200 * 1024 * 1024
export const POSTER_MAX_BYTES = 5 * 1024 * 1024
export const clipContentTypes = ['video/mp4', 'video/webm', 'video/quicktime'] as const
export const posterContentTypes = ['image/jpeg', 'image/png', 'image/webp'] as const
export const mediaPurposes = ['clip', 'poster'] as const
export type MediaPurpose = typeof mediaPurposes[number]

export const mediaExtensions: Record<string, string> = {
  'video/mp4': 'mp4',
  'video/webm': 'webm',
  'video/quicktime': 'mov',
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
}

const cueSchema = z.string({ error: 'A cue is text' }).trim().min(1, 'Write the cue or remove it').max(EXERCISE_LIMITS.cue, `A cue is at most ${EXERCISE_LIMITS.cue} characters`)

const equipmentItemSchema = z.string({ error: 'Equipment is text' }).trim().min(1, 'Name the equipment or remove it').max(EXERCISE_LIMITS.equipmentItem, `At most ${EXERCISE_LIMITS.equipmentItem} characters`)

export const exerciseCautionSchema = z.object({
  text: z.string({ error: 'Write the caution' }).trim().min(1, 'Write the caution or remove it').max(EXERCISE_LIMITS.caution, `A caution is at most ${EXERCISE_LIMITS.caution} characters`),
  bodyAreas: z.array(z.enum(bodyAreas.values, { error: 'Pick a body area from the list' }), { error: 'Body areas are a list' })
    .max(bodyAreas.values.length, 'Too many body areas')
    .refine(areas => new Set(areas).size === areas.length, 'Each body area once')
    .default([]),
})

const exerciseFields = {
  name: z.string({ error: 'Name is required' }).trim().min(1, 'Name is required').max(EXERCISE_LIMITS.name, `Name is at most ${EXERCISE_LIMITS.name} characters`),
  category: z.enum(exerciseCategories.values, { error: `Pick a category: ${exerciseCategories.values.map(key => exerciseCategories.labels[key]).join(', ')}` }),
  summary: z.string({ error: 'Summary is text' }).trim().max(EXERCISE_LIMITS.summary, `Summary is at most ${EXERCISE_LIMITS.summary} characters`),
  cues: z.array(cueSchema, { error: 'Cues are a list' }).max(EXERCISE_LIMITS.cues, `At most ${EXERCISE_LIMITS.cues} cues`),
  equipment: z.array(equipmentItemSchema, { error: 'Equipment is a list' })
    .max(EXERCISE_LIMITS.equipment, `At most ${EXERCISE_LIMITS.equipment} pieces of equipment`)
    .refine(items => new Set(items.map(item => item.toLowerCase())).size === items.length, 'List each piece of equipment once'),
  cautions: z.array(exerciseCautionSchema, { error: 'Cautions are a list' }).max(EXERCISE_LIMITS.cautions, `At most ${EXERCISE_LIMITS.cautions} cautions`),
}

export const exerciseInputSchema = z.object({
  ...exerciseFields,
  summary: exerciseFields.summary.default(''),
  cues: exerciseFields.cues.default([]),
  equipment: exerciseFields.equipment.default([]),
  cautions: exerciseFields.cautions.default([]),
})
export type ExerciseInput = z.output<typeof exerciseInputSchema>

/** A change to some fields: absent fields stay as they are (no defaults fill them in). */
export const exercisePatchSchema = z.object(exerciseFields).partial()

export const exerciseSorts = ['name', 'category', 'updated', 'clip'] as const

const booleanQuery = z.enum(['true', 'false', ''], { error: 'Use true or false' }).optional()
  .transform(value => (value === 'true' ? true : value === 'false' ? false : undefined))

export const exerciseListQuerySchema = z.object({
  q: z.string().trim().max(EXERCISE_LIMITS.name, 'Search is at most 120 characters').optional(),
  category: z.union([z.enum(exerciseCategories.values, { error: 'Unknown category' }), z.literal('')]).optional()
    .transform(value => value || undefined),
  equipment: z.string().trim().max(EXERCISE_LIMITS.equipmentItem, 'Equipment is at most 60 characters').optional()
    .transform(value => value || undefined),
  hasClip: booleanQuery,
  status: z.enum(['active', 'archived', 'all'], { error: 'Status is active, archived or all' }).default('active'),
  sort: z.enum(exerciseSorts, { error: 'Sort by name, category, updated or clip' }).default('name'),
  dir: z.enum(['asc', 'desc'], { error: 'Direction is asc or desc' }).default('asc'),
  page: z.coerce.number({ error: 'Page is a number' }).int('Page is a whole number').min(1, 'Pages start at 1').max(10_000, 'Page is too large').default(1),
  pageSize: z.coerce.number({ error: 'Page size is a number' }).int('Page size is a whole number').min(1, 'At least 1 per page').max(100, 'At most 100 per page').default(20),
})
export type ExerciseListQuery = z.input<typeof exerciseListQuerySchema>

export const clipUploadRequestSchema = z.object({
  contentType: z.string({ error: 'Say what kind of file this is' }).trim().toLowerCase(),
  size: z.number({ error: 'Size is a number of bytes' }).int('Size is a whole number of bytes').positive('The file is empty'),
  purpose: z.enum(mediaPurposes, { error: 'Upload a clip or a poster' }).default('clip'),
}).superRefine((input, context) => {
  const clip = input.purpose === 'clip'
  const types: readonly string[] = clip ? clipContentTypes : posterContentTypes
  if (!types.includes(input.contentType)) {
    context.addIssue({ code: 'custom', path: ['contentType'], message: clip ? 'Upload an MP4, WebM or QuickTime (.mov) video' : 'Upload a JPEG, PNG or WebP image' })
  }
  const max = clip ? CLIP_MAX_BYTES : POSTER_MAX_BYTES
  if (input.size > max) {
    context.addIssue({ code: 'custom', path: ['size'], message: clip ? 'A clip can be at most 200 MB' : 'A poster image can be at most 5 MB' })
  }
})

export const clipConfirmSchema = z.object({
  key: z.string({ error: 'The upload key is required' }).trim().min(1, 'The upload key is required').max(500, 'The upload key is too long'),
})

export const clipDeleteQuerySchema = z.object({
  purpose: z.enum(['clip', 'poster', 'all'], { error: 'Remove the clip, the poster or all' }).default('all'),
})

/** An exercise as the routes answer it. */
export interface ExerciseView {
  id: number
  name: string
  category: ExerciseCategory
  summary: string
  cues: string[]
  equipment: string[]
  cautions: { text: string, bodyAreas: BodyArea[] }[]
  hasClip: boolean
  /** Duration and picture size are read from the container at confirm; null when it did not say. */
  clip: { contentType: string, size: number, durationSeconds: number | null, width: number | null, height: number | null } | null
  hasPoster: boolean
  archivedAt: string | null
  createdAt: string
  updatedAt: string
}

export function formatBytes(bytes: number) {
  if (bytes < 1024) return `${bytes} B`
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(0)} KB`
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`
}

/** What a coach reads under the clip: type, size, length and picture size, e.g. "WEBM · 120 KB · 4.5 s · 320×240". */
export function clipDetails(exercise: Pick<ExerciseView, 'clip' | 'hasPoster'>) {
  const clip = exercise.clip
  if (!clip) return ''
  return [
    clip.contentType.replace('video/', '').replace('quicktime', 'mov').toUpperCase(),
    formatBytes(clip.size),
    clip.durationSeconds !== null ? `${clip.durationSeconds.toFixed(1)} s` : null,
    clip.width && clip.height ? `${clip.width}×${clip.height}` : null,
    exercise.hasPoster ? 'with poster image' : null,
  ].filter(Boolean).join(' · ')
}
