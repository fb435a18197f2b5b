// Turns the solver's arrays into the NetworkResult of the physics contract (L/min, kPa).

import { STANDARD_GRAVITY } from '../units'
import type { LinkResult, Network, NetworkResult } from '../types'
import type { LinkTable } from './link-table'
import type { PreparedNetwork } from './prepare'
import { takeInts, takeReals } from './scratch'

// a local copy: a module binding can cost a getter call per use in some module loaders
const G = STANDARD_GRAVITY

export function buildResult(
  network: Network,
  prep: PreparedNetwork,
  /** evaluated at the final flows, by position in prep.solvedLinks */
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
  const pressure = takeReals(nodeCount)
  for (let v = 0; v < nodeCount; v++) pressure[v] = (prep.referenceHead + head[v]! - elevation[v]!) * kpaPerMetre
  const nodePressureKpa: Record<string, number> = {}
  for (let v = 0; v < nodeCount; v++) {
    if (componentOf[v] === refComponent) nodePressureKpa[network.nodes[v]!.id] = pressure[v]!
  }
  const linkCount = network.links.length
  const links: LinkResult[] = new Array(linkCount)
  const { h, friction } = table
  const positionOf = takeInts(linkCount).fill(-1)
  const solved = prep.solvedLinks
  for (let k = 0; k < solved.length; k++) positionOf[solved[k]!] = k
  for (let i = 0; i < linkCount; i++) {
    const law = laws[i]
    const id = network.links[i]!.id
    if (!law) {
      links[i] = { id, flowLpm: 0, velocityMS: null, reynolds: null, frictionFactor: null, dropKpa: 0, headLossKpa: 0 }
      continue
    }
    const q = flows[i]!
    const a = from[i]!
    const b = to[i]!
    // p_from − p_to; defined even in a group without a pressure level, since only differences enter
    const dropKpa = pressure[a]! - pressure[b]!
    const k = positionOf[i]!
    // each result is made once with its final values, so that all share one object shape
    let velocityMS: number | null = null
    let reynolds: number | null = null
    let frictionFactor: number | null = null
    let headLossKpa: number
    if (law.kind === 'fixed-flow') headLossKpa = (head[a]! - head[b]!) * kpaPerMetre
    else {
      headLossKpa = h[k]! * kpaPerMetre
      if (law.kind === 'pipe') {
        const f = friction[k]!
        velocityMS = q / law.area
        reynolds = table.reynolds(k, q)
        frictionFactor = Number.isFinite(f) ? f : null
      } else if (law.kind === 'quadratic' && law.diameterM) {
        velocityMS = table.velocity(k, q)!
        reynolds = (Math.abs(velocityMS) * law.diameterM) / nu
      }
    }
    links[i] = { id, flowLpm: q * 60000, velocityMS, reynolds, frictionFactor, dropKpa, headLossKpa }
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
