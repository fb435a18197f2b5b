// Fuel circuits for the tests: the demo conversion and small changes to it, so each figure can be
// followed from the drawing.
import type { CircuitDocument, Component, FuelSettings, Hose } from '#shared/circuit'
import { parseCircuitDocument } from '#shared/circuit'
import { correctedFuelDemoDocument, fuelDemoDocument } from '#shared/demo'
import { analyzeCircuit, type Finding, type Report } from '#shared/engine'

/** Parses as the app would, so a fixture mistake fails loudly with its paths. */
export function valid(doc: CircuitDocument): CircuitDocument {
  const r = parseCircuitDocument(JSON.parse(JSON.stringify(doc)))
  if (!r.ok) throw new Error(r.issues.map((i) => `${i.path}: ${i.message}`).join('\n'))
  return r.document
}

/** The conversion with its return line run: no errors. */
export const returnStyle = (): CircuitDocument => correctedFuelDemoDocument()
/** The conversion as first opened: the return line is still to run. */
export const withoutReturn = (): CircuitDocument => fuelDemoDocument()

export function comp<T extends Component['type']>(doc: CircuitDocument, id: string, type?: T): Extract<Component, { type: T }> {
  const c = doc.circuit.components.find((x) => x.id === id)
  if (!c || (type && c.type !== type)) throw new Error(`no ${type ?? 'part'} ${id}`)
  return c as Extract<Component, { type: T }>
}

export function hoseOf(doc: CircuitDocument, id: string): Hose {
  const h = doc.circuit.hoses.find((x) => x.id === id)
  if (!h) throw new Error(`no hose ${id}`)
  return h
}

export function setFuel(doc: CircuitDocument, patch: Partial<FuelSettings>): CircuitDocument {
  doc.circuit.settings.fuel = { ...doc.circuit.settings.fuel!, ...patch }
  return doc
}

export const analyse = (doc: CircuitDocument): Report => analyzeCircuit(valid(doc))
export const codes = (doc: CircuitDocument): string[] => analyse(doc).findings.map((f) => f.code)
export const withCode = (doc: CircuitDocument, code: string): Finding[] => analyse(doc).findings.filter((f) => f.code === code)
