import { z } from 'zod'
import { idParam } from './common'

// Cues pinned to moments of a clip: one set of rules for the cue editor and the cue routes.

export const CLIP_CUE_LIMITS = {
  perClip: 40,
  text: 140,
  /** When a clip's duration is unknown (stored before durations were read), times stay under an hour. */
  unknownDurationSeconds: 3600,
  /** Smallest keyboard nudge on the timeline. */
  nudgeSeconds: 0.1,
} as const

const seconds = (what: string) => z.number({ error: `${what} is a number of seconds` })
  .finite(`${what} is a number of seconds`)
  .min(0, `${what} cannot be before the clip starts`)
  .transform(value => Math.round(value * 1000) / 1000)

const cueText = z.string({ error: 'Write the cue' }).trim()
  .min(1, 'Write the cue')
  .max(CLIP_CUE_LIMITS.text, `A cue is at most ${CLIP_CUE_LIMITS.text} characters`)

export const clipCueInputSchema = z.object({
  startSeconds: seconds('The start'),
  endSeconds: seconds('The end').nullable().default(null),
  text: cueText,
})
export type ClipCueInput = z.input<typeof clipCueInputSchema>

export const clipCuePatchSchema = z.object({
  startSeconds: seconds('The start').optional(),
  endSeconds: seconds('The end').nullable().optional(),
  text: cueText.optional(),
})

export const clipCueParamsSchema = z.object({ id: idParam, cueId: idParam })

/** After a clip is replaced by a shorter one: stretch every cue to the new length, or pull late ones in. */
export const clipCueFitSchema = z.object({
  mode: z.enum(['scale', 'clamp'], { error: 'Fit by scale or clamp' }),
  fromSeconds: z.number({ error: 'The old clip length is a number of seconds' }).finite().positive('The old clip length is more than 0').optional(),
}).refine(input => input.mode !== 'scale' || input.fromSeconds !== undefined, { path: ['fromSeconds'], message: 'Scaling needs the old clip length' })

export interface ClipCueView {
  id: number
  startSeconds: number
  endSeconds: number | null
  text: string
}

/**
 * Field messages for a cue that does not fit its clip: times within the clip's length, the end after
 * the start. Returns an empty object when the cue fits.
 */
export function cueTimeProblems(cue: { startSeconds: number, endSeconds: number | null }, durationSeconds: number | null): Record<string, string> {
  const limit = durationSeconds ?? CLIP_CUE_LIMITS.unknownDurationSeconds
  const problems: Record<string, string> = {}
  const shown = `${limit.toFixed(1)} s`
  if (cue.startSeconds > limit) problems.startSeconds = `The start is past the end of the clip (${shown})`
  if (cue.endSeconds !== null) {
    if (cue.endSeconds > limit) problems.endSeconds = `The end is past the end of the clip (${shown})`
    else if (cue.endSeconds <= cue.startSeconds) problems.endSeconds = 'The end comes after the start'
  }
  return problems
}
