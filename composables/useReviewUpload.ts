import { reviewUploadRequestSchema } from '#shared/schemas/review'
import { fieldErrors } from '#shared/utils/errors'

function messageOf(error: unknown) {
  return apiErrorMessage(error, (error as Error)?.message || 'The upload failed; try again')
}

/**
 * A review clip straight to the store: a presigned PUT with real progress, then a confirming call
 * (`finish`) that receives the key. `retry()` sends the last file again.
 */
export function useReviewUpload() {
  const phase = ref<'idle' | 'uploading' | 'checking' | 'done' | 'failed'>('idle')
  const percent = ref(0)
  const error = ref('')
  let last: { file: File, signPath: string, finish: (key: string) => Promise<unknown> } | undefined

  async function send(file: File, signPath: string, finish: (key: string) => Promise<unknown>) {
    last = { file, signPath, finish }
    error.value = ''
    percent.value = 0
    const contentType = file.type || (file.name.toLowerCase().endsWith('.mov') ? 'video/quicktime' : '')
    const checked = reviewUploadRequestSchema.safeParse({ contentType, size: file.size })
    if (!checked.success) {
      phase.value = 'failed'
      error.value = Object.values(fieldErrors(checked.error))[0] ?? 'This file cannot be sent'
      return null
    }
    try {
      phase.value = 'uploading'
      const signed = await $fetch<{ url: string, key: string }>(signPath, { method: 'POST', body: checked.data })
      await putWithProgress(signed.url, file, checked.data.contentType, (done, of) => {
        percent.value = of ? Math.round((done / of) * 100) : 0
      }, {})
      phase.value = 'checking'
      const result = await finish(signed.key)
      phase.value = 'done'
      return result
    }
    catch (caught) {
      phase.value = 'failed'
      error.value = messageOf(caught)
      return null
    }
  }

  function retry() {
    return last ? send(last.file, last.signPath, last.finish) : Promise.resolve(null)
  }

  return { phase: readonly(phase), percent: readonly(percent), error: readonly(error), send, retry }
}
