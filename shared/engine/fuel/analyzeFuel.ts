// The fuel half of the engine: runs only on fuel circuits, after the layout checks both kinds share
// (open ports, free hose ends, direction, size misfits).
import type { AnalysisContext } from '../context'
import type { Finding } from '../report'
import { fuelLayout } from './layout'
import { filterPlacement, hoseNotFuelRated, noReturnLine } from './layoutChecks'
import { fuelQuantities } from './quantities'
import { demandIncomplete, injectorUndersized, lineVelocity, pumpUndersized, regulatorUnreferenced } from './sizingChecks'
import type { FuelQuantities } from './types'

export interface FuelAnalysis {
  findings: Finding[]
  quantities: FuelQuantities
}

export function analyzeFuel(ctx: AnalysisContext): FuelAnalysis {
  const layout = fuelLayout(ctx)
  const q = fuelQuantities(ctx, layout)
  const findings = [
    ...noReturnLine(ctx, layout),
    ...filterPlacement(ctx, layout),
    ...hoseNotFuelRated(ctx, layout, q),
    ...regulatorUnreferenced(ctx, layout),
    ...pumpUndersized(ctx, q),
    ...injectorUndersized(ctx, q),
    ...lineVelocity(ctx, q),
    ...demandIncomplete(ctx, layout, q),
  ]
  return { findings, quantities: q }
}

/**
 * A missing return line already names the regulator's open return port and the tank spigot it should
 * reach; the same ports are not reported again as open.
 */
export function withoutSupersededOpenPorts(findings: Finding[]): Finding[] {
  const covered = new Set(findings.filter((f) => f.code === 'no-return-line').flatMap((f) => f.elementIds))
  if (covered.size === 0) return findings
  return findings.filter((f) => f.code !== 'open-port' || !f.elementIds.some((id) => covered.has(id) && f.fix.action?.type === 'block-port' && f.fix.action.portId === id))
}
