import { z } from 'zod'
import { bodyId, idParam } from './common'
import { clipContentTypes } from './exercise'

// Form review: one set of rules for the athlete's upload, the coach's comments and the routes.

export const REVIEW_LIMITS = {
  clipBytes: 100 * 1024 * 1024,
  clipSeconds: 60,
  question: 500,
  comment: 2000,
  retentionDaysDefault: 180,
} as const

export const reviewUploadRequestSchema = z.object({
  contentType: z.string({ error: 'Say what kind of file this is' }).trim().toLowerCase()
    .refine(type => (clipContentTypes as readonly string[]).includes(type), 'Send a video: MP4, WebM or QuickTime (.mov)'),
  size: z.number({ error: 'Size is a number of bytes' }).int('Size is a whole number of bytes').positive('The file is empty')
    .max(REVIEW_LIMITS.clipBytes, 'A review clip can be at most 100 MB'),
})

export const reviewCreateSchema = z.object({
  key: z.string({ error: 'The upload key is required' }).trim().min(1, 'The upload key is required').max(500, 'The upload key is too long'),
  question: z.string({ error: 'The question is text' }).trim().max(REVIEW_LIMITS.question, `A question is at most ${REVIEW_LIMITS.question} characters`).default(''),
  assignmentId: bodyId.optional(),
  stepId: z.string().trim().max(100, 'The step id is too long').optional(),
})

export const reviewCommentSchema = z.object({
  atSeconds: z.number({ error: 'The moment is a number of seconds' }).finite('The moment is a number of seconds')
    .min(0, 'The moment cannot be before the clip starts').transform(value => Math.round(value * 1000) / 1000),
  text: z.string({ error: 'Write the comment' }).trim().min(1, 'Write the comment')
    .max(REVIEW_LIMITS.comment, `A comment is at most ${REVIEW_LIMITS.comment} characters`),
})

export const reviewAnswerSchema = z.object({
  replyKey: z.string().trim().min(1).max(500, 'The upload key is too long').optional(),
})

export const reviewPatchSchema = z.object({
  exerciseId: bodyId.nullable(),
})

export const reviewListQuerySchema = z.object({
  status: z.enum(['open', 'answered', 'all'], { error: 'Status is open, answered or all' }).default('all'),
  squadId: z.coerce.number({ error: 'Squad is a number' }).int().positive().optional(),
})

export const reviewParamsSchema = z.object({ id: idParam })

export interface ReviewComment { id: number, atSeconds: number, text: string, authorName: string | null, createdAt: string }

export interface ReviewSummary {
  id: number
  athleteId: number
  athleteName: string
  question: string
  status: 'open' | 'answered'
  durationSeconds: number | null
  createdAt: string
  answeredAt: string | null
}

export interface ReviewView extends ReviewSummary {
  clip: { url: string, contentType: string, width: number | null, height: number | null }
  reply: { url: string, contentType: string } | null
  exercise: { id: number, name: string, cues: string[] } | null
  comments: ReviewComment[]
  assignmentId: number | null
  stepId: string | null
}
