import { z } from 'zod'
import { buildWebVtt } from '#shared/utils/webvtt'

const captionParams = z.object({
  id: z.string().regex(/^[1-9]\d{0,12}\.vtt$/, 'Use /captions/<exercise id>.vtt').transform(value => Number(value.replace(/\.vtt$/, ''))),
})

/**
 * The exercise's clip cues as a WebVTT text track, for `<track kind="captions">`. Same access as the
 * clip: the team's coaches, and athletes for exercises in their own assignments; 404 for anyone else.
 */
export default defineEventHandler(async (event) => {
  const caller = await requireTeamRole(event, 'athlete')
  // The router names this segment's parameter after the whole file name ("id.vtt"): take the one there is.
  const raw = String(Object.values(getRouterParams(event, { decode: true }))[0] ?? '')
  const parsed = captionParams.safeParse({ id: raw })
  if (!parsed.success) notFound('No such captions')
  const db = await useDb()
  const { exercise, clip } = await findTeamExercise(db, caller, parsed.data.id)
  const cues = exercise.clipId ? await listClipCues(db, caller.teamId, exercise.id) : []
  setResponseHeader(event, 'content-type', 'text/vtt; charset=utf-8')
  setResponseHeader(event, 'cache-control', 'private, no-store')
  return buildWebVtt(cues, clip?.durationSeconds ?? null)
})
