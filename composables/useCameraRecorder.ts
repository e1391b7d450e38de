import { chooseRecordingType, clipTypeOfRecording, recordingFileName, recordingStopSeconds } from '#shared/utils/recording'

export type RecorderPhase = 'idle' | 'starting' | 'recording' | 'finishing' | 'recorded' | 'refused'

/** Keeps a recording small enough for the 100 MB limit: about 19 MB a minute. */
const VIDEO_BITS_PER_SECOND = 2_500_000

function cameraProblem(error: unknown) {
  const name = (error as DOMException)?.name
  if (name === 'NotAllowedError' || name === 'SecurityError') return 'The camera was not allowed. Pick a video file instead, or allow the camera in your browser\'s settings and try again.'
  if (name === 'NotFoundError' || name === 'OverconstrainedError') return 'No camera was found on this device. Pick a video file instead.'
  if (name === 'NotReadableError') return 'The camera is busy in another app. Close it and try again, or pick a video file.'
  return 'The camera could not be started. Pick a video file instead.'
}

/**
 * Chromium's recorder writes WebM without its length (it streams as it goes), so a player reading the clip
 * from the store in ranges may show no duration (`Infinity`) and a coach could not reliably seek to a moment.
 * fix-webm-duration (23 kB, loaded only once a clip was recorded) writes the measured length into the
 * header; for other containers, or if it fails, the recording goes as it is (the server still finds its
 * length by walking the packets).
 */
async function withLength(blob: Blob, milliseconds: number): Promise<Blob> {
  if (!blob.type.startsWith('video/webm')) return blob
  try {
    const { default: fixWebmDuration } = await import('fix-webm-duration')
    return await fixWebmDuration(blob, milliseconds, { logger: false })
  }
  catch {
    return blob
  }
}

/**
 * Recording a clip in the page with the device's camera (getUserMedia + MediaRecorder): a live view while
 * recording, an automatic stop at the limit, then a File ready for the same upload as a picked one.
 * `supported` is false (and the page offers only the file picker) where either API is missing.
 */
export function useCameraRecorder(options: { limitSeconds: number, withSound: boolean }) {
  const supported = ref(false)
  const phase = ref<RecorderPhase>('idle')
  const elapsed = ref(0)
  const problem = ref('')
  const stream = shallowRef<MediaStream | null>(null)
  const clip = shallowRef<File | null>(null)
  const clipUrl = ref('')
  let recorder: MediaRecorder | undefined
  let ticker: ReturnType<typeof setInterval> | undefined

  onMounted(() => {
    supported.value = typeof MediaRecorder !== 'undefined' && typeof navigator.mediaDevices?.getUserMedia === 'function'
  })

  function release() {
    if (ticker) clearInterval(ticker)
    ticker = undefined
    for (const track of stream.value?.getTracks() ?? []) track.stop()
    stream.value = null
  }

  function forgetClip() {
    if (clipUrl.value) URL.revokeObjectURL(clipUrl.value)
    clipUrl.value = ''
    clip.value = null
  }

  async function openCamera() {
    const video = { facingMode: 'environment', width: { ideal: 1280 }, height: { ideal: 720 } }
    try {
      return await navigator.mediaDevices.getUserMedia({ video, audio: options.withSound })
    }
    catch (error) {
      // No microphone (or it is refused) should not cost the picture: try once more without sound.
      if (!options.withSound) throw error
      return navigator.mediaDevices.getUserMedia({ video, audio: false })
    }
  }

  async function start() {
    if (phase.value === 'starting' || phase.value === 'recording') return
    forgetClip()
    problem.value = ''
    elapsed.value = 0
    phase.value = 'starting'
    try {
      stream.value = await openCamera()
    }
    catch (error) {
      problem.value = cameraProblem(error)
      phase.value = (error as DOMException)?.name === 'NotReadableError' ? 'idle' : 'refused'
      return
    }
    const mimeType = chooseRecordingType(type => MediaRecorder.isTypeSupported(type))
    const chunks: Blob[] = []
    let startedAt = 0
    try {
      recorder = new MediaRecorder(stream.value, { ...(mimeType ? { mimeType } : {}), videoBitsPerSecond: VIDEO_BITS_PER_SECOND })
    }
    catch {
      release()
      problem.value = 'This browser cannot record video here. Pick a video file instead.'
      phase.value = 'refused'
      return
    }
    recorder.ondataavailable = (event) => {
      if (event.data.size) chunks.push(event.data)
    }
    recorder.onstop = async () => {
      release()
      phase.value = 'finishing'
      const written = recorder?.mimeType || mimeType
      const type = clipTypeOfRecording(written)
      const blob = await withLength(new Blob(chunks, { type: written }), performance.now() - startedAt)
      // Discarded (or started again) while the length was being written.
      if (phase.value !== 'finishing') return
      clip.value = new File([blob], recordingFileName(type, new Date()), { type })
      clipUrl.value = URL.createObjectURL(blob)
      phase.value = 'recorded'
    }
    startedAt = performance.now()
    const stopAt = recordingStopSeconds(options.limitSeconds)
    ticker = setInterval(() => {
      elapsed.value = (performance.now() - startedAt) / 1000
      if (elapsed.value >= stopAt) stop()
    }, 100)
    recorder.start(1000)
    phase.value = 'recording'
  }

  function stop() {
    if (ticker) clearInterval(ticker)
    ticker = undefined
    if (recorder && recorder.state !== 'inactive') recorder.stop()
  }

  /** Back to the start, dropping any recording (after a file was picked instead, say). */
  function discard() {
    if (recorder && recorder.state !== 'inactive') {
      recorder.onstop = null
      recorder.stop()
    }
    release()
    forgetClip()
    problem.value = ''
    if (phase.value !== 'refused') phase.value = 'idle'
  }

  onScopeDispose(discard)

  return {
    supported: readonly(supported),
    phase: readonly(phase),
    elapsed: readonly(elapsed),
    problem: readonly(problem),
    stream: computed(() => stream.value),
    clip: computed(() => clip.value),
    clipUrl: readonly(clipUrl),
    start,
    stop,
    discard,
  }
}
