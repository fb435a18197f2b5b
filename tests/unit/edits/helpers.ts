// Shared helpers for the edit tests: validity as the server checks it, and frozen inputs that throw
// when an edit tries to change them.
import { expect } from 'vitest'
import { CIRCUIT_FORMAT, CIRCUIT_FORMAT_VERSION, parseCircuitDocument, type CircuitDocument } from '#shared/circuit'
import { emptyCircuitSettings } from '#shared/circuit/defaults'

/** Fails with the failing paths when a document would not pass the server's parse. */
export function expectValid(doc: CircuitDocument): void {
  const parsed = parseCircuitDocument(JSON.parse(JSON.stringify(doc)))
  expect(parsed.ok ? [] : parsed.issues.map((i) => `${i.path}: ${i.message}`)).toEqual([])
}

/** Freezes a document all the way down, so any mutation by an edit throws (modules run in strict mode). */
export function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value)
    for (const v of Object.values(value as Record<string, unknown>)) deepFreeze(v)
  }
  return value
}

export function emptyDoc(kind: 'coolant' | 'fuel' = 'coolant'): CircuitDocument {
  return {
    format: CIRCUIT_FORMAT, formatVersion: CIRCUIT_FORMAT_VERSION,
    circuit: { kind, title: 'Bench drawing', settings: emptyCircuitSettings(kind), components: [], hoses: [] },
  }
}

export function portById(doc: CircuitDocument, id: string) {
  for (const c of doc.circuit.components) for (const p of c.ports) if (p.id === id) return { comp: c, port: p }
  throw new Error(`no port ${id}`)
}

export const hoseById = (doc: CircuitDocument, id: string) => {
  const h = doc.circuit.hoses.find((x) => x.id === id)
  if (!h) throw new Error(`no hose ${id}`)
  return h
}
