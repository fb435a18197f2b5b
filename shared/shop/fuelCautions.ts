// The cautions every fuel procedure opens with, and a stop when the check still finds errors.
import type { Report } from '../engine'
import type { ProcedureStep } from './procedureTypes'

const caution = (id: string, text: string, elementIds: string[] = []): ProcedureStep => ({ id: `caution/${id}`, phase: 'cautions', kind: 'caution', text, elementIds })

/** Always present, always first, in this order. */
export function fuelCautions(regulatorIds: string[]): ProcedureStep[] {
  return [
    caution('fire',
      'Petrol and its vapour catch fire from a spark, a hot exhaust or a naked flame: no smoking, no flames, no grinding or welding nearby, ' +
      'no trouble lamps with bare bulbs. Have a working fire extinguisher for fuel fires within reach before any line is opened.'),
    caution('ventilation',
      'Work outdoors or with the doors wide open: fuel vapour is heavier than air, gathers in pits and low corners, and is harmful to breathe.'),
    caution('eyes',
      'Wear eye protection and fuel-resistant gloves: fuel under pressure sprays when a joint is opened or a hose lets go.'),
    caution('battery',
      'Disconnect the battery (the negative lead first) before opening any line, and connect it again only to run the pump for priming.'),
    caution('relieve-pressure',
      'Relieve the pressure before opening anything: an injection system holds its pressure for hours after the pump stops. ' +
      'With the engine off, take out the pump fuse or relay and crank or run the engine until it stops, or let the pressure off at the rail\'s test valve into a rag over a container.',
      regulatorIds),
    caution('maker-data',
      "This procedure is generated from the drawing. Follow the pump, regulator, injector and vehicle makers' data and the local regulations where they differ or say more; they come first."),
  ]
}

/** A circuit that still has error findings is not primed: the step says which. */
export function fuelErrorStop(report: Report): ProcedureStep[] {
  const errors = report.findings.filter((f) => f.severity === 'error')
  if (errors.length === 0) return []
  return [caution('errors',
    `Do not prime yet: the check still finds ${errors.length} error${errors.length > 1 ? 's' : ''}. ` +
    errors.map((f) => f.message).join(' ') + ` Put ${errors.length > 1 ? 'them' : 'it'} right and check again first.`,
    [...new Set(errors.flatMap((f) => f.elementIds))])]
}
