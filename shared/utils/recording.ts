import { clipContentTypes } from '../schemas/exercise'

/**
 * What the in-page recorder asks the browser for, in order: WebM (Chromium, Firefox, Android), then MP4
 * (Safari). Both are containers the review upload accepts and whose length the server can read.
 */
export const recordingTypes = ['video/webm;codecs=vp9,opus', 'video/webm;codecs=vp8,opus', 'video/webm', 'video/mp4'] as const

/** The first type this browser's MediaRecorder can write, or '' to let it choose. */
export function chooseRecordingType(isTypeSupported: (type: string) => boolean): string {
  return recordingTypes.find(type => isTypeSupported(type)) ?? ''
}

/**
 * The upload's content type for what the recorder wrote: codecs dropped (`video/webm;codecs=vp8` →
 * `video/webm`), and '' when it is not a container reviews take (the upload then refuses it by name).
 */
export function clipTypeOfRecording(mimeType: string): string {
  const base = mimeType.split(';')[0]!.trim().toLowerCase()
  return (clipContentTypes as readonly string[]).includes(base) ? base : ''
}

/** A file name for a recording made at `at`: `clip-2026-03-15-0712.webm`. */
export function recordingFileName(contentType: string, at: Date): string {
  const pad = (value: number) => String(value).padStart(2, '0')
  const stamp = `${at.getFullYear()}-${pad(at.getMonth() + 1)}-${pad(at.getDate())}-${pad(at.getHours())}${pad(at.getMinutes())}`
  return `clip-${stamp}.${contentType === 'video/mp4' ? 'mp4' : 'webm'}`
}

/**
 * When the recorder stops on its own: a quarter second before the limit, so timer lateness on a busy phone
 * still leaves the clip within the server's length check (limit + 0.5 s).
 */
export function recordingStopSeconds(limitSeconds: number): number {
  return limitSeconds - 0.25
}
