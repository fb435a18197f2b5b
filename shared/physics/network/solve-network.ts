// Steady flow in a closed coolant network by the Global Gradient Algorithm (Todini & Pilati 1988,
// the method of EPANET 2): Newton's method on all link equations h_i(Q_i) = H_from − H_to and node
// continuity at once. Each step solves one symmetric positive definite node system, sparse (see
// sparse-ldl.ts), so a step costs close to O(links).
//
// We use the correction form of the step. With p_i = 1/(dh_i/dQ_i) and the current heads H,
//   Q̃_i = Q_i − p_i·h_i(Q_i) + p_i·(H_from − H_to),
//   A·δ = net inflow of Q̃ (plus forced flows) at each node,  A_jj = Σ p_i, A_jk = −p_i,
//   Q_i ← Q̃_i + p_i·(δ_from − δ_to),  H ← H + δ.
// This is algebraically the classic GGA update, but its right-hand side is a continuity residual that
// vanishes at the solution, so the rounding does not grow with the head level (pump heads of hundreds
// of metres would otherwise limit the flows to ~1e-9). Heads are metres of the circulating fluid,
// relative to the reference head; flows are m³/s.

import type { Network, NetworkResult } from '../types'
import type { FrictionLaw } from './link-models'
import { LinkTable } from './link-table'
import { initialFlows, prepareNetwork } from './prepare'
import { buildResult } from './result'
import { GradientIteration } from './newton'
import { scratchMark, scratchRelease, takeReals } from './scratch'
import { SparseSpdSolver } from './sparse-ldl'
import { balanceOnSpanningForest, largestImbalance } from './topology'

/** node imbalance (fraction of the node's throughput or of the largest flow) that the final balancing removes */
const CONTINUITY_SLACK = 1e-13

export interface SolveOptions {
  maxIterations?: number
  /**
   * stop once a full Newton step changes the flows by at most this fraction: the sum of the flow
   * changes against the sum of the flows, EPANET's test (default 1e-6; EPANET's own default is 1e-3
   * and its smallest 1e-5). Newton converges quadratically there, so the flows are then within about
   * 1e-9 of the largest flow of the exact solution (measured on the benchmark networks: 2e-16–8e-9).
   */
  relativeTolerance?: number
  /**
   * friction factor above Re = 2300; default: our Colebrook with the transitional blend (friction.ts).
   * Exists so that the solver can be compared with programs that use another law.
   */
  frictionLaw?: FrictionLaw
}

export function solveNetwork(network: Network, options: SolveOptions = {}): NetworkResult {
  // every typed array of the solve lives in the scratch space, given back at the end
  const mark = scratchMark()
  try {
    return solveInScratch(network, options)
  } finally {
    scratchRelease(mark)
  }
}

function solveInScratch(network: Network, options: SolveOptions): NetworkResult {
  const maxIterations = options.maxIterations ?? 100
  const tolerance = options.relativeTolerance ?? 1e-6
  const prep = prepareNetwork(network)
  const { from, to, solvedLinks, fixedFlows, problems } = prep
  const nodeCount = network.nodes.length
  const flows = initialFlows(prep)
  const system = new SparseSpdSolver(prep.unknownCount, prep.edgeI, prep.edgeJ, true)
  const table = new LinkTable(solvedLinks.map(i => prep.laws[i]!), options.frictionLaw)
  const newton = new GradientIteration(prep, system, table, flows)
  const outcome = newton.run(maxIterations, tolerance, i => flows[i]!)
  const { converged, iterations } = outcome
  if (outcome.message) problems.push({ kind: 'not-converged', ids: [], message: outcome.message })
  const weight = takeReals(flows.length)
  for (let k = 0; k < solvedLinks.length; k++) {
    flows[solvedLinks[k]!] = newton.q[k]!
    weight[solvedLinks[k]!] = newton.p[k]!
  }
  if (outcome.diverged) for (const pump of fixedFlows) flows[pump.index] = 0
  else {
    if (largestImbalance(nodeCount, from, to, solvedLinks, fixedFlows, flows) > CONTINUITY_SLACK) {
      balanceOnSpanningForest(nodeCount, from, to, solvedLinks, weight, fixedFlows, prep.datumOf.values(), flows)
      for (let k = 0; k < solvedLinks.length; k++) newton.q[k] = flows[solvedLinks[k]!]!
    }
    if (!converged) problems.push({ kind: 'not-converged', ids: [], message: `no convergence within ${maxIterations} iterations` })
  }
  // Final losses, friction factors and Reynolds numbers at the reported flows. After convergence one
  // Clamond step from the last roots is exact to rounding (third order from within ~1e-6); otherwise
  // Colebrook is solved afresh.
  table.evaluate(newton.q, !converged)
  return buildResult(network, prep, table, flows, newton.head, converged, iterations)
}
