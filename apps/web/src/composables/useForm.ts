import { reactive, ref } from 'vue'
import type { z } from 'zod'
import { ApiError } from '../api/client'

/** Where a message belongs: the field's path, dotted for nested fields (`citation.year`), as the API's 422 says it. */
export const fieldKey = (path: readonly PropertyKey[]) => path.map(String).join('.')

/**
 * Form state checked with the same zod schema the API uses; server-side 422 details land on the same fields.
 * Errors are keyed by the full dotted path, so a nested field (`citation.year`) keeps its own message.
 */
export function useForm<S extends z.ZodObject>(schema: S, initial: z.input<S>) {
  const values = reactive({ ...initial }) as z.input<S>
  const errors = ref<Record<string, string>>({})
  const formError = ref<string | null>(null)
  const busy = ref(false)

  function validate(): z.output<S> | null {
    const r = schema.safeParse(values)
    errors.value = {}
    if (r.success) return r.data
    for (const i of r.error.issues) errors.value[fieldKey(i.path)] ??= i.message
    return null
  }

  /** Validate, run `action`, and put any server error on its field or on the form. */
  async function submit(action: (data: z.output<S>) => Promise<void>): Promise<boolean> {
    formError.value = null
    const data = validate()
    if (!data) return false
    busy.value = true
    try {
      await action(data)
      return true
    } catch (e) {
      if (e instanceof ApiError) {
        const fields = e.fieldErrors()
        errors.value = fields
        formError.value = Object.keys(fields).length ? null : e.message
      } else formError.value = 'Something went wrong. Try again.'
      return false
    } finally {
      busy.value = false
    }
  }
  return { values, errors, formError, busy, submit, validate }
}
