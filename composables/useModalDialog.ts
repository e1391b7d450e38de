import type { Ref } from 'vue'

const focusable = 'a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled]), video[controls], [tabindex]:not([tabindex="-1"])'

/**
 * A native `<dialog>` opened as a modal, with focus kept inside it (Tab and Shift+Tab wrap around) and
 * handed back to whatever had it before the dialog opened, once it closes.
 */
export function useModalDialog(dialog: Ref<HTMLDialogElement | null | undefined>) {
  let returnTo: HTMLElement | null = null

  function open() {
    returnTo = document.activeElement instanceof HTMLElement ? document.activeElement : null
    if (!dialog.value?.open) dialog.value?.showModal()
  }

  function close() {
    if (dialog.value?.open) dialog.value.close()
  }

  /** Bind to the dialog's `close` event (Escape closes a modal dialog too). */
  function onClosed() {
    const target = returnTo
    returnTo = null
    if (target?.isConnected) target.focus()
  }

  /** Bind to the dialog's `keydown`. */
  function onKeydown(event: KeyboardEvent) {
    if (event.key !== 'Tab' || !dialog.value) return
    const items = [...dialog.value.querySelectorAll<HTMLElement>(focusable)].filter(item => item.offsetParent !== null || item === document.activeElement)
    if (!items.length) return
    const first = items[0]!
    const last = items.at(-1)!
    if (event.shiftKey && document.activeElement === first) {
      event.preventDefault()
      last.focus()
    }
    else if (!event.shiftKey && document.activeElement === last) {
      event.preventDefault()
      first.focus()
    }
  }

  onBeforeUnmount(() => {
    if (dialog.value?.open) {
      dialog.value.close()
    }
  })

  return { open, close, onClosed, onKeydown }
}
