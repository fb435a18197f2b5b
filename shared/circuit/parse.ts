import type { z } from 'zod'
import { crossReferenceIssues, type CircuitIssue } from './crossReferences'
import { circuitDocumentSchema, type CircuitDocument } from './document'

export type ParseCircuitResult =
  | { ok: true; document: CircuitDocument }
  | { ok: false; issues: CircuitIssue[] }

/** zod's path ['circuit', 'hoses', 3, 'to', 'portId'] written as circuit.hoses[3].to.portId */
export function formatPath(path: ReadonlyArray<PropertyKey>): string {
  let out = ''
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`
    else out += out === '' ? String(key) : `.${String(key)}`
  }
  return out === '' ? '(document)' : out
}

export function formatIssues(issues: CircuitIssue[]): string[] {
  return issues.map((i) => `${i.path}: ${i.message}`)
}

function zodIssues(error: z.ZodError): CircuitIssue[] {
  return error.issues.map((i) => ({ path: formatPath(i.path), message: i.message }))
}

/**
 * Reads a circuit document (a parsed JSON value or the JSON text). Every failing path is listed; the
 * cross-reference checks run once the shapes are right, because they need the shapes to mean anything.
 */
export function parseCircuitDocument(input: unknown): ParseCircuitResult {
  let value = input
  if (typeof input === 'string') {
    try {
      value = JSON.parse(input)
    } catch (e) {
      return { ok: false, issues: [{ path: '(document)', message: `Not valid JSON: ${(e as Error).message}` }] }
    }
  }
  const parsed = circuitDocumentSchema.safeParse(value)
  if (!parsed.success) return { ok: false, issues: zodIssues(parsed.error) }
  const document = parsed.data as CircuitDocument
  const issues = crossReferenceIssues(document)
  return issues.length > 0 ? { ok: false, issues } : { ok: true, document }
}
