// One entry point for the technician's procedure, whatever the circuit carries.
import type { CircuitDocument, CircuitKindName } from '../circuit'
import type { Report } from '../engine'
import { fillAndBleedProcedure } from './fillAndBleed'
import type { ProcedureResult } from './procedureTypes'

type Generator = (document: CircuitDocument, report: Report) => ProcedureResult

/** One generator per circuit kind: a fuel leak-and-prime procedure replaces the placeholder here. */
const GENERATORS: Record<CircuitKindName, Generator> = {
  coolant: fillAndBleedProcedure,
  fuel: (document) => ({
    kind: 'fuel-leak-and-prime',
    available: false,
    title: 'Leak test and prime',
    circuitTitle: document.circuit.title,
    reason: 'A leak-and-prime procedure is not available for fuel circuits yet.',
  }),
}

export function procedureFor(document: CircuitDocument, report: Report): ProcedureResult {
  return GENERATORS[document.circuit.kind](document, report)
}
