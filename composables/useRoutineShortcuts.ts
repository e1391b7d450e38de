/**
 * The builder's keys (Ctrl/⌘+Z undo, Ctrl/⌘+Shift+Z or Ctrl/⌘+Y redo, Ctrl/⌘+S save) and the guards
 * against leaving with unsaved changes (closing the tab, or following a link inside the app).
 */
export function useRoutineShortcuts(options: { save: () => unknown, confirmLeave?: () => boolean }) {
  const draft = useRoutineDraftStore()
  const confirmLeave = options.confirmLeave ?? (() => window.confirm('This routine has unsaved changes. Leave without saving?'))

  function onKeydown(event: KeyboardEvent) {
    if (!(event.ctrlKey || event.metaKey)) return
    const key = event.key.toLowerCase()
    if (key === 'z' && !event.shiftKey) {
      event.preventDefault()
      draft.undo()
    }
    else if ((key === 'z' && event.shiftKey) || key === 'y') {
      event.preventDefault()
      draft.redo()
    }
    else if (key === 's') {
      event.preventDefault()
      options.save()
    }
  }

  function onBeforeUnload(event: BeforeUnloadEvent) {
    if (!draft.dirty) return
    event.preventDefault()
    event.returnValue = ''
  }

  onMounted(() => {
    window.addEventListener('keydown', onKeydown)
    window.addEventListener('beforeunload', onBeforeUnload)
  })
  onBeforeUnmount(() => {
    window.removeEventListener('keydown', onKeydown)
    window.removeEventListener('beforeunload', onBeforeUnload)
  })
  onBeforeRouteLeave(() => {
    if (draft.dirty && !confirmLeave()) return false
  })
}
