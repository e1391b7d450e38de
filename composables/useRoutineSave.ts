import type { ApiError } from '~/composables/useApiError'

type Saved = { id: number, version: number }

/**
 * Saving the routine draft: create or update, field errors from the server onto the draft, and the way out
 * of a version conflict (load the saved version, or keep this work as a copy). `onInvalid` is called when
 * the draft has errors, so the page can open the steps that hold them.
 */
export function useRoutineSave(options: { onInvalid: () => void, afterUpdate?: () => Promise<void> | void }) {
  const draft = useRoutineDraftStore()
  const saving = ref(false)
  const message = ref('')
  const messageTone = ref<'error' | 'success' | 'info'>('info')
  const conflict = ref<{ currentVersion?: number } | null>(null)
  /** Set by the first save attempt: from then on every field shows its error, touched or not. */
  const attempted = ref(false)

  const status = computed(() => {
    if (saving.value) return 'Saving…'
    if (!draft.dirty) return draft.routineId ? `Saved · version ${draft.version}` : 'Not saved yet'
    return 'Unsaved changes'
  })

  function say(tone: 'error' | 'success' | 'info', text: string) {
    messageTone.value = tone
    message.value = text
  }

  async function save() {
    message.value = ''
    conflict.value = null
    attempted.value = true
    if (!draft.valid) {
      say('error', `Fix the ${draft.errorCount === 1 ? 'highlighted field' : `${draft.errorCount} highlighted fields`} before saving.`)
      options.onInvalid()
      return
    }
    saving.value = true
    try {
      const body = draft.payload()
      if (draft.routineId) {
        draft.markSaved(await $fetch<Saved>(`/api/routines/${draft.routineId}`, { method: 'PUT', body }))
        await options.afterUpdate?.()
      }
      else {
        const created = await $fetch<Saved>('/api/routines', { method: 'POST', body })
        draft.markSaved(created)
        await navigateTo(`/routines/${created.id}`, { replace: true })
      }
      say('success', 'Saved.')
    }
    catch (error) {
      refused(readApiError(error, 'Saving failed; check your connection and try again.'))
    }
    finally {
      saving.value = false
    }
  }

  function refused(error: ApiError) {
    messageTone.value = 'error'
    if (error.status === 409) {
      conflict.value = { currentVersion: error.data.currentVersion as number | undefined }
      return
    }
    const fields = error.fields
    if (error.status === 400 && Object.keys(fields).length) {
      draft.applyServerErrors(fields)
      options.onInvalid()
      message.value = 'The server found problems in the highlighted fields.'
      return
    }
    message.value = error.message
  }

  async function reloadSaved() {
    if (!draft.routineId) return
    const fresh = await $fetch(`/api/routines/${draft.routineId}`)
    draft.load(fresh as Parameters<typeof draft.load>[0])
    conflict.value = null
    say('info', 'Loaded the latest saved version.')
  }

  async function saveAsCopy() {
    saving.value = true
    try {
      const { version: _version, ...body } = draft.payload() as ReturnType<typeof draft.payload> & { version?: number }
      const created = await $fetch<Saved>('/api/routines', { method: 'POST', body: { ...body, title: `${body.title} (my version)`.slice(0, 120) } })
      draft.markSaved(created)
      conflict.value = null
      await navigateTo(`/routines/${created.id}`)
    }
    catch (error) {
      refused(readApiError(error, 'Saving failed; check your connection and try again.'))
    }
    finally {
      saving.value = false
    }
  }

  return {
    saving: readonly(saving),
    message: readonly(message),
    messageTone: readonly(messageTone),
    conflict,
    attempted: readonly(attempted),
    status,
    save,
    reloadSaved,
    saveAsCopy,
  }
}
