import { useForm, type TypedSchema } from 'vee-validate'
import type { z } from 'zod'

/**
 * vee-validate form driven by one of the shared zod schemas (the same one the API route uses).
 * vee-validate 4's own zod adapter targets zod 3, so this adapts zod 4's safeParse to its
 * TypedSchema interface.
 */
export function zodTypedSchema<S extends z.ZodType>(schema: S): TypedSchema<z.input<S>, z.output<S>> {
  return {
    __type: 'VVTypedSchema',
    async parse(values) {
      const result = await schema.safeParseAsync(values)
      if (result.success) return { value: result.data, errors: [] }
      const byPath = new Map<string, string[]>()
      for (const issue of result.error.issues) {
        const path = issue.path.map(String).join('.')
        byPath.set(path, [...(byPath.get(path) ?? []), issue.message])
      }
      return { errors: [...byPath].map(([path, errors]) => ({ path, errors })) }
    },
  }
}

export function useZodForm<S extends z.ZodType>(schema: S, initialValues?: Partial<z.input<S>>) {
  const describe = useApiError()
  const form = useForm({ validationSchema: zodTypedSchema(schema), initialValues: initialValues as never })
  const formError = ref('')

  /** Validates, calls `send` with the parsed values, and maps server field errors back on failure. */
  function submitWith(send: (values: z.output<S>) => Promise<unknown>) {
    return form.handleSubmit(async (values) => {
      formError.value = ''
      try {
        await send(values as z.output<S>)
      } catch (error) {
        const info = describe(error)
        form.setErrors(info.fields as never)
        formError.value = info.message
      }
    })
  }

  return { ...form, formError, submitWith }
}
