import type { H3Event } from 'h3'
import type { z } from 'zod'

export interface FieldIssue { path: string; message: string }

export function issuesOf(error: z.ZodError): FieldIssue[] {
  return error.issues.map(i => ({ path: i.path.map(String).join('.') || '(input)', message: i.message }))
}

/** 400 with every failing field, first message per field in `fields` for forms. */
export function invalidInput(issues: FieldIssue[], message = 'Please correct the marked fields.'): never {
  const fields: Record<string, string> = {}
  for (const issue of issues) fields[issue.path] ??= issue.message
  throw createError({ statusCode: 400, statusMessage: 'Invalid input', message, data: { fields, issues } })
}

// h3's validators wrap anything thrown; ours return the zod result and throw the 400 themselves
// so the client gets field messages in a stable shape.
function check<S extends z.ZodType>(schema: S) {
  return (data: unknown) => schema.safeParse(data)
}

function unwrap<S extends z.ZodType>(result: z.ZodSafeParseResult<z.output<S>>): z.output<S> {
  if (!result.success) invalidInput(issuesOf(result.error))
  return result.data
}

export async function bodyOf<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  return unwrap<S>(await readValidatedBody(event, check(schema)))
}

export async function queryOf<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  return unwrap<S>(await getValidatedQuery(event, check(schema)))
}

/** Route params that do not fit the schema (e.g. not a UUID) can match no row: 404. */
export async function paramsOf<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.output<S>> {
  const result = await getValidatedRouterParams(event, check(schema))
  if (!result.success) throw createError({ statusCode: 404, statusMessage: 'Not found' })
  return result.data
}

export function notFound(what = 'Not found'): never {
  throw createError({ statusCode: 404, statusMessage: 'Not found', message: what })
}
