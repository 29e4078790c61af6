import { reactive, ref } from 'vue'
import type { z } from 'zod'
import { ApiRequestError } from '@/api/http'
import { messagesByPath } from '@/display/messagesByPath'

/**
 * Field messages for a naive-ui form, from the same zod schema the server uses and from the
 * server's own `issues` (a weak password, a spent link), each beside the field it names.
 * Issues for a field the form does not show (a link's token) appear above the form instead.
 */
export function useFormErrors<const Field extends string>(fields: readonly Field[]) {
  const fieldErrors = reactive({}) as Partial<Record<Field, string>>
  const formError = ref<string | undefined>()

  function reset(): void {
    for (const field of fields) delete fieldErrors[field]
    formError.value = undefined
  }

  /** Each message beside the field its path starts with (`pack.count` → `pack`), first kept. */
  function show(messages: ReadonlyMap<string, string>): void {
    for (const [path, message] of messages) {
      const field = fields.find((candidate) => candidate === path.split('.')[0])
      if (field) fieldErrors[field] ??= message
      else formError.value ??= message
    }
  }

  /** The parsed input, or undefined with the messages shown. */
  function validate<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> | undefined {
    reset()
    const result = schema.safeParse(value)
    if (result.success) return result.data
    show(messagesByPath(result.error.issues))
    return undefined
  }

  /** Shows a failed request: its issues by field, or its message above the form. */
  function showRequestError(error: unknown): void {
    if (error instanceof ApiRequestError && error.issues.length > 0) {
      show(messagesByPath(error.issues))
    } else {
      formError.value = error instanceof Error ? error.message : 'Something went wrong; try again.'
    }
  }

  return { fieldErrors, formError, reset, validate, showRequestError }
}

/**
 * A form's submit: check the values with the shared schema, send them, and show what failed
 * beside the fields. `busy` is true while the request runs.
 */
export function useSchemaForm<const Field extends string, S extends z.ZodType>(options: {
  fields: readonly Field[]
  schema: S
  values: () => unknown
  send: (input: z.infer<S>) => Promise<unknown>
}) {
  const errors = useFormErrors(options.fields)
  const busy = ref(false)

  async function submit(): Promise<void> {
    const input = errors.validate(options.schema, options.values())
    if (input === undefined) return
    busy.value = true
    try {
      await options.send(input)
    } catch (error) {
      errors.showRequestError(error)
    } finally {
      busy.value = false
    }
  }

  return { ...errors, busy, submit }
}
