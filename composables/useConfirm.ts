export interface ConfirmQuestion {
  question: string
  confirmLabel: string
  cancelLabel?: string
  tone?: 'danger' | 'primary'
}

// One question at a time, asked through the app's own dialog (components/ui/UiConfirmHost.vue, mounted
// once in app.vue). Only set by a person's click in the browser, never while rendering on the server.
const asking = shallowRef<(ConfirmQuestion & { answer: (yes: boolean) => void }) | null>(null)

/** `if (!(await ask({ question, confirmLabel }))) return` in place of the browser's `confirm()`. */
export function useConfirm() {
  function ask(question: ConfirmQuestion): Promise<boolean> {
    asking.value?.answer(false)
    return new Promise((resolve) => {
      asking.value = {
        ...question,
        answer: (yes) => {
          asking.value = null
          resolve(yes)
        },
      }
    })
  }
  return { ask, asking: readonly(asking) }
}
