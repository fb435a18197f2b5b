// One entry point for the technician's procedure, whatever the circuit carries.
import type { CircuitDocument, CircuitKindName } from '../circuit'
import type { Report } from '../engine'
import { fillAndBleedProcedure } from './fillAndBleed'
import { leakAndPrimeProcedure } from './leakAndPrime'
import type { ProcedureResult } from './procedureTypes'

type Generator = (document: CircuitDocument, report: Report) => ProcedureResult

/** One generator per circuit kind: fill and bleed for coolant, leak test and prime for fuel. */
const GENERATORS: Record<CircuitKindName, Generator> = {
  coolant: fillAndBleedProcedure,
  fuel: leakAndPrimeProcedure,
}

export function procedureFor(document: CircuitDocument, report: Report): ProcedureResult {
  return GENERATORS[document.circuit.kind](document, report)
}
