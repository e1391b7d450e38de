import { clipUploadRequestSchema, type ExerciseView, type MediaPurpose } from '#shared/schemas/exercise'
import { fieldErrors } from '#shared/utils/errors'

function messageOf(error: unknown) {
  return apiErrorMessage(error, 'The upload failed; try again')
}

/** PUT straight to the store with XMLHttpRequest, the one browser API that reports upload progress. */
function putWithProgress(url: string, file: File, contentType: string, onProgress: (loaded: number, total: number) => void, signal: { abort?: () => void }) {
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
  const percent = computed(() => (total.value ? Math.round((loaded.value / total.value) * 100) : 0))
  const busy = computed(() => ['signing', 'uploading', 'checking'].includes(phase.value))

  async function upload(file: File, purpose: MediaPurpose = 'clip'): Promise<ExerciseView | null> {
    error.value = ''
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
      error.value = caught instanceof Error && !(caught as { data?: unknown }).data ? caught.message : messageOf(caught)
      return null
    }
  }

  function cancel() {
    signal.abort?.()
  }

  return { phase: readonly(phase), loaded: readonly(loaded), total: readonly(total), percent, busy, error: readonly(error), upload, cancel }
}
