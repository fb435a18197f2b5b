// Turns the solver's arrays into the NetworkResult of the physics contract (L/min, kPa).

import { STANDARD_GRAVITY as G } from '../units'
import type { LinkResult, Network, NetworkResult } from '../types'
import type { LinkTable } from './link-table'
import type { PreparedNetwork } from './prepare'

export function buildResult(
  network: Network,
  prep: PreparedNetwork,
  table: LinkTable,
  flows: Float64Array,
  /** heads relative to the reference head, every node */
  head: Float64Array,
  converged: boolean,
  iterations: number,
): NetworkResult {
  const { laws, from, to, elevation, componentOf, refComponent, problems } = prep
  const rho = network.fluid.densityKgM3
  const nu = network.fluid.viscosityPaS / rho
  const kpaPerMetre = (rho * G) / 1000
  // gauge pressure from the head above the reference head: p = ρg·(H − z)
  const nodeCount = network.nodes.length
  const pressure = new Float64Array(nodeCount)
  for (let v = 0; v < nodeCount; v++) pressure[v] = (prep.referenceHead + head[v]! - elevation[v]!) * kpaPerMetre
  const nodePressureKpa: Record<string, number> = {}
  for (let v = 0; v < nodeCount; v++) {
    if (componentOf[v] === refComponent) nodePressureKpa[network.nodes[v]!.id] = pressure[v]!
  }
  const linkCount = network.links.length
  const links: LinkResult[] = new Array(linkCount)
  const h = table.h
  for (let i = 0; i < linkCount; i++) {
    const law = laws[i]
    const q = flows[i]!
    const result: LinkResult = { id: network.links[i]!.id, flowLpm: law ? q * 60000 : 0, velocityMS: null, reynolds: null, frictionFactor: null, dropKpa: 0, headLossKpa: 0 }
    links[i] = result
    if (!law) continue
    const a = from[i]!
    const b = to[i]!
    // p_from − p_to; defined even in a group without a pressure level, since only differences enter
    result.dropKpa = pressure[a]! - pressure[b]!
    if (law.kind === 'fixed-flow') {
      result.headLossKpa = (head[a]! - head[b]!) * kpaPerMetre
      continue
    }
    result.headLossKpa = h[i]! * kpaPerMetre
    if (law.kind === 'pipe') {
      const f = table.friction[i]!
      result.velocityMS = table.velocity(i, q)
      result.reynolds = table.reynolds(i, q)
      result.frictionFactor = Number.isFinite(f) ? f : null
    } else if (law.kind === 'quadratic' && law.diameterM) {
      const v = table.velocity(i, q)!
      result.velocityMS = v
      result.reynolds = (Math.abs(v) * law.diameterM) / nu
    }
  }
  const isolatedNodes = [...prep.isolatedNodes, ...prep.invalid, ...[...prep.switchedOff].map(i => network.links[i]!.id)]
  const blocking = problems.some(p => p.kind === 'no-return-path' || p.kind === 'no-reference')
  const out: NetworkResult = { converged: converged && !blocking, iterations, links, nodePressureKpa, isolatedNodes }
  if (problems.length) {
    out.problems = problems
    out.message = problems.map(p => p.message).join('. ')
  }
  return out
}
