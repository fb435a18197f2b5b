// The cautions every coolant procedure opens with, and a stop when the check still finds errors.
import type { Report } from '../engine'
import type { ProcedureStep } from './procedureTypes'

const caution = (id: string, text: string, elementIds: string[] = []): ProcedureStep => ({ id: `caution/${id}`, phase: 'cautions', kind: 'caution', text, elementIds })

/** Always present, always first, in this order. */
export function standardCautions(capIds: string[]): ProcedureStep[] {
  return [
    caution('hot-cap',
      'Never open a pressure cap or a pressurised tank cap while the engine is hot: the coolant can boil out and scald. ' +
      'Wait until the cap is cool to the bare hand, then turn it to its first stop with a rag over it and let the pressure go before lifting it off.',
      capIds),
    caution('glycol',
      'Glycol coolant is poisonous and tastes sweet. Keep it and every container away from children and animals, ' +
      'catch drained coolant in a tray, wipe up spills at once and take waste coolant to a collection point.'),
    caution('fans-belts',
      'An electric fan can start at any moment, even with the ignition off, and a running engine drives belts and pulleys: ' +
      'keep hands, hair, sleeves and tools clear of the fan, belts and pulleys.'),
    caution('hot-surfaces',
      'Exhaust, turbocharger, engine, radiator and hoses get hot enough to burn within minutes of starting: wear gloves and do not lean on them.'),
    caution('maker-data',
      "This procedure is generated from the drawing. Follow the engine and part makers' data, local codes and licensed practice where they differ or say more; they come first."),
  ]
}

/** A circuit that still has error findings is not filled: the step says which. */
export function errorStop(report: Report): ProcedureStep[] {
  const errors = report.findings.filter((f) => f.severity === 'error')
  if (errors.length === 0) return []
  return [caution('errors',
    `Do not fill yet: the check still finds ${errors.length} error${errors.length > 1 ? 's' : ''}. ` +
    errors.map((f) => f.message).join(' ') + ` Put ${errors.length > 1 ? 'them' : 'it'} right and check again first.`,
    [...new Set(errors.flatMap((f) => f.elementIds))])]
}
