import { ALL_FORMATS, Input, StreamSource } from 'mediabunny'

export interface ClipMetadata {
  durationSeconds: number | null
  width: number | null
  height: number | null
  /** How many bytes were fetched from the store to learn this (the container's header, index and a tail). */
  bytesRead: number
}

/**
 * A clip's duration and picture size, read from its container (MP4, QuickTime or WebM) in the store
 * with ranged GETs of just the parts the demuxer asks for: nothing is transcoded or downloaded whole.
 * Answers nulls when the container does not say; never throws for an odd file.
 */
export async function readClipMetadata(key: string, size: number): Promise<ClipMetadata> {
  let bytesRead = 0
  const source = new StreamSource({
    getSize: () => size,
    read: async (start, end) => {
      const bytes = await readObjectRange(key, start, Math.min(end, size))
      bytesRead += bytes.byteLength
      return bytes
    },
    maxCacheSize: 8 * 1024 * 1024,
    prefetchProfile: 'network',
  })
  const input = new Input({ formats: ALL_FORMATS, source })
  try {
    const track = await input.getPrimaryVideoTrack()
    // The container's own duration field first; only without one are the packets walked for it.
    const duration = (await input.getDurationFromMetadata()) ?? (await input.computeDuration())
    return {
      durationSeconds: Number.isFinite(duration) && duration > 0 ? Math.round(duration * 1000) / 1000 : null,
      width: track?.displayWidth || null,
      height: track?.displayHeight || null,
      bytesRead,
    }
  }
  catch (error) {
    console.warn(`[clip-metadata] ${key}:`, (error as Error)?.message ?? error)
    return { durationSeconds: null, width: null, height: null, bytesRead }
  }
  finally {
    input.dispose()
  }
}
