import { clipUploadRequestSchema, type ExerciseView, type MediaPurpose } from '#shared/schemas/exercise'
import { fieldErrors } from '#shared/utils/errors'

function messageOf(error: unknown) {
  return apiErrorMessage(error, 'The upload failed; try again')
}

/** PUT straight to the store with XMLHttpRequest, the one browser API that reports upload progress. */
export function putWithProgress(url: string, file: File, contentType: string, onProgress: (loaded: number, total: number) => void, signal: { abort?: () => void }) {
  return new Promise<void>((resolve, reject) => {
    const request = new XMLHttpRequest()
    signal.abort = () => request.abort()
    request.open('PUT', url)
    request.setRequestHeader('content-type', contentType)
    request.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded, event.total)
    }
    request.onload = () => (request.status >= 200 && request.status < 300
      ? resolve()
      : reject(new Error(`The store refused the file (${request.status})`)))
    request.onerror = () => reject(new Error('The upload was interrupted; check the connection and try again'))
    request.onabort = () => reject(new Error('Upload cancelled'))
    request.send(file)
  })
}

/**
 * One clip (or poster) upload: ask for a presigned URL, send the file straight to the store with
 * progress, then ask the server to check it and attach it to the exercise.
 */
export function useClipUpload(exerciseId: MaybeRefOrGetter<number>) {
  const phase = ref<'idle' | 'signing' | 'uploading' | 'checking' | 'done' | 'failed'>('idle')
  const loaded = ref(0)
  const total = ref(0)
  const error = ref('')
  const signal: { abort?: () => void } = {}
  // The last file that failed, so a store or network outage ends in "try again", not "choose it again".
  const failedUpload = shallowRef<{ file: File, purpose: MediaPurpose } | null>(null)
  const percent = computed(() => (total.value ? Math.round((loaded.value / total.value) * 100) : 0))
  const busy = computed(() => ['signing', 'uploading', 'checking'].includes(phase.value))

  async function upload(file: File, purpose: MediaPurpose = 'clip'): Promise<ExerciseView | null> {
    error.value = ''
    failedUpload.value = null
    loaded.value = 0
    total.value = file.size
    const contentType = file.type || (file.name.toLowerCase().endsWith('.mov') ? 'video/quicktime' : '')
    const checked = clipUploadRequestSchema.safeParse({ contentType, size: file.size, purpose })
    if (!checked.success) {
      phase.value = 'failed'
      error.value = Object.values(fieldErrors(checked.error))[0] ?? 'This file cannot be uploaded'
      return null
    }
    const id = toValue(exerciseId)
    try {
      phase.value = 'signing'
      const signed = await $fetch<{ url: string, key: string }>(`/api/exercises/${id}/clip/upload-url`, { method: 'POST', body: checked.data })
      phase.value = 'uploading'
      await putWithProgress(signed.url, file, checked.data.contentType, (done, of) => {
        loaded.value = done
        total.value = of
      }, signal)
      loaded.value = total.value
      phase.value = 'checking'
      const exercise = await $fetch<ExerciseView>(`/api/exercises/${id}/clip/confirm`, { method: 'POST', body: { key: signed.key } })
      phase.value = 'done'
      return exercise
    }
    catch (caught) {
      phase.value = 'failed'
      if ((caught as Error).message !== 'Upload cancelled') failedUpload.value = { file, purpose }
      error.value = caught instanceof Error && !(caught as { data?: unknown }).data ? caught.message : messageOf(caught)
      return null
    }
  }

  function cancel() {
    signal.abort?.()
  }

  /** Sends the file that failed again, from the start (a new upload URL; nothing half-recorded remains). */
  function retry() {
    const failed = failedUpload.value
    return failed ? upload(failed.file, failed.purpose) : Promise.resolve(null)
  }
  const canRetry = computed(() => phase.value === 'failed' && failedUpload.value !== null)

  return { phase: readonly(phase), loaded: readonly(loaded), total: readonly(total), percent, busy, error: readonly(error), upload, cancel, retry, canRetry }
}

function once(target: EventTarget, name: string, timeoutMs: number) {
  return new Promise<boolean>((resolve) => {
    const timer = setTimeout(() => resolve(false), timeoutMs)
    target.addEventListener(name, () => {
      clearTimeout(timer)
      resolve(true)
    }, { once: true })
  })
}

/**
 * A JPEG of one frame of a video file, drawn on a canvas in the browser (a third of the way in, at most
 * 1 s), at most 1280 px wide. Null when the browser cannot decode the file.
 */
export async function capturePosterFrame(file: File): Promise<File | null> {
  const url = URL.createObjectURL(file)
  const video = document.createElement('video')
  video.muted = true
  video.playsInline = true
  video.preload = 'auto'
  video.src = url
  try {
    if (!(await once(video, 'loadeddata', 8000))) return null
    const at = Number.isFinite(video.duration) ? Math.min(1, video.duration / 3) : 0
    if (at > 0) {
      video.currentTime = at
      await once(video, 'seeked', 5000)
    }
    const scale = Math.min(1, 1280 / (video.videoWidth || 1280))
    const canvas = document.createElement('canvas')
    canvas.width = Math.max(1, Math.round(video.videoWidth * scale))
    canvas.height = Math.max(1, Math.round(video.videoHeight * scale))
    canvas.getContext('2d')?.drawImage(video, 0, 0, canvas.width, canvas.height)
    const blob = await new Promise<Blob | null>(resolve => canvas.toBlob(resolve, 'image/jpeg', 0.82))
    return blob ? new File([blob], 'poster.jpg', { type: 'image/jpeg' }) : null
  }
  catch {
    return null
  }
  finally {
    URL.revokeObjectURL(url)
    video.removeAttribute('src')
    video.load()
  }
}
