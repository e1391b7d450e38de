// WebVTT (W3C, "WebVTT: The Web Video Text Tracks Format") for a clip's cues.

export interface TimedText {
  startSeconds: number
  endSeconds: number | null
  text: string
}

/** How long a cue without an end stays up: until just before the next cue, at most this long, and never past the clip. */
export const DEFAULT_CUE_SECONDS = 2.5
/** The gap left before the next cue, so two captions never show at once on the boundary. */
const GAP_SECONDS = 0.05

/** `hh:mm:ss.ttt`, the timestamp form WebVTT always accepts. */
export function vttTimestamp(seconds: number) {
  const millis = Math.max(0, Math.round(seconds * 1000))
  const hours = Math.floor(millis / 3_600_000)
  const minutes = Math.floor(millis / 60_000) % 60
  const secs = Math.floor(millis / 1000) % 60
  const rest = millis % 1000
  const pad = (value: number, width = 2) => String(value).padStart(width, '0')
  return `${pad(hours)}:${pad(minutes)}:${pad(secs)}.${pad(rest, 3)}`
}

/**
 * Cue text as WebVTT needs it: `&`, `<` and `>` as character references, and no "-->" (which would
 * end the cue), no blank line (which would too) and no line breaks at all, since our cues are one line.
 */
export function escapeVttText(text: string) {
  return text
    .replace(/[\r\n]+/g, ' ')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .trim()
}

/** The shown end of each cue: its own, or until the next cue starts (at most DEFAULT_CUE_SECONDS), within the clip. */
export function cueEnds<T extends TimedText>(cues: T[], durationSeconds: number | null): (T & { shownEnd: number })[] {
  const sorted = [...cues].sort((a, b) => a.startSeconds - b.startSeconds)
  return sorted.map((cue, index) => {
    const next = sorted.slice(index + 1).find(other => other.startSeconds > cue.startSeconds)
    let end = cue.endSeconds ?? Math.min(cue.startSeconds + DEFAULT_CUE_SECONDS, next ? next.startSeconds - GAP_SECONDS : Number.POSITIVE_INFINITY)
    if (durationSeconds !== null && cue.endSeconds === null) end = Math.min(end, Math.max(durationSeconds, cue.startSeconds + 0.1))
    if (end <= cue.startSeconds) end = cue.startSeconds + 0.1
    return { ...cue, shownEnd: end }
  })
}

/** A WebVTT file with one numbered cue per item. */
export function buildWebVtt(cues: TimedText[], durationSeconds: number | null = null) {
  const blocks = cueEnds(cues, durationSeconds).map((cue, index) =>
    `${index + 1}\n${vttTimestamp(cue.startSeconds)} --> ${vttTimestamp(cue.shownEnd)}\n${escapeVttText(cue.text)}`)
  return `WEBVTT\n\n${blocks.join('\n\n')}${blocks.length ? '\n' : ''}`
}

/** `m:ss.t` for lists and the timeline, e.g. 0:02.5. */
export function formatCueTime(seconds: number) {
  const tenths = Math.max(0, Math.round(seconds * 10))
  const minutes = Math.floor(tenths / 600)
  const rest = (tenths % 600) / 10
  return `${minutes}:${rest.toFixed(1).padStart(4, '0')}`
}
