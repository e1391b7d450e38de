import type { z } from 'zod'
import { fieldErrors } from '#shared/utils/errors'

/**
 * Form state checked with the same zod schema the server uses: errors show once a field is touched
 * (or after a submit), and field messages from a 4xx answer land beside their fields.
 */
export function useZodForm<S extends z.ZodObject>(schema: S, initial: z.input<S>) {
  const values = reactive({ ...initial }) as z.input<S>
  const touched = reactive<Record<string, boolean>>({})
  const serverErrors = ref<Record<string, string>>({})
  const formError = ref('')
  const submitted = ref(false)
  const pending = ref(false)

  const clientErrors = computed(() => {
    const result = schema.safeParse(values)
    return result.success ? {} : fieldErrors(result.error)
  })

  const errors = computed(() => {
    const shown: Record<string, string> = {}
    for (const [field, message] of Object.entries(clientErrors.value)) {
      if (submitted.value || touched[field]) shown[field] = message
    }
    return { ...shown, ...serverErrors.value }
  })

  function touch(field: string) {
    touched[field] = true
    serverErrors.value = Object.fromEntries(Object.entries(serverErrors.value).filter(([key]) => key !== field))
  }

  /** Back to a clean form (after a successful submit, say), without showing errors for the empty fields. */
  function reset(next: Partial<z.input<S>> = {}) {
    Object.assign(values, { ...initial, ...next })
    for (const field of Object.keys(touched)) touched[field] = false
    submitted.value = false
    serverErrors.value = {}
  }

  async function submit(action: (data: z.output<S>) => Promise<void>) {
    submitted.value = true
    formError.value = ''
    serverErrors.value = {}
    const result = schema.safeParse(values)
    if (!result.success) return
    pending.value = true
    try {
      await action(result.data)
    }
    catch (error) {
      const refused = readApiError(error)
      serverErrors.value = refused.fields
      formError.value = Object.keys(refused.fields).length ? (refused.data.fields?._ ?? '') : refused.message
    }
    finally {
      pending.value = false
    }
  }

  /**
   * Everything a field component needs for one key, to spread with `v-bind="field('email')"`:
   * its name, value and setter, its shown error, and touching it on blur.
   */
  function field<K extends keyof z.input<S> & string>(name: K) {
    return {
      'name': name,
      'modelValue': values[name],
      // The control hands back its own value type (a select's, a text box's); the schema checks it.
      'onUpdate:modelValue': (value: unknown) => { values[name] = value as z.input<S>[K] },
      'error': errors.value[name],
      'onBlur': () => touch(name),
    }
  }

  return { values, errors, formError, pending, touch, submit, reset, field }
}
