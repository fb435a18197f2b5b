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
import { SparseSpdSolver } from './sparse-ldl'
import { balanceOnSpanningForest, largestImbalance } from './topology'

/** node imbalance (fraction of the node's throughput or of the largest flow) that the final balancing removes */
const CONTINUITY_SLACK = 1e-13
/** relative flow change below which a step that no longer shrinks counts as converged to rounding */
const ROUNDING_PLATEAU = 1e-7

export interface SolveOptions {
  maxIterations?: number
  /**
   * stop when the flows' remaining error, estimated from the last two Newton steps, is below this
   * fraction of the largest flow (default 1e-10)
   */
  relativeTolerance?: number
  /**
   * friction factor above Re = 2300; default: our Colebrook with the transitional blend (friction.ts).
   * Exists so that the solver can be compared with programs that use another law.
   */
  frictionLaw?: FrictionLaw
}

export function solveNetwork(network: Network, options: SolveOptions = {}): NetworkResult {
  const maxIterations = options.maxIterations ?? 100
  const tolerance = options.relativeTolerance ?? 1e-10
  const prep = prepareNetwork(network)
  const { from, to, unknown, unknownCount: m, solvedLinks, edgeOfLink, fixedFlows, problems } = prep
  const nodeCount = network.nodes.length
  const flows = initialFlows(prep)
  const system = new SparseSpdSolver(m, prep.edgeI, prep.edgeJ)
  const table = new LinkTable(prep.laws, options.frictionLaw)
  const rhs = new Float64Array(m)
  const headStep = new Float64Array(m)
  // heads (relative to the reference) and head steps for every node; fixed nodes keep theirs
  const head = new Float64Array(nodeCount)
  const step = new Float64Array(nodeCount)
  for (let v = 0; v < nodeCount; v++) if (unknown[v]! < 0) head[v] = prep.fixedHead[v]!
  const p = new Float64Array(flows.length)
  const qt = new Float64Array(flows.length)
  // matrix slots of each solved link: diagonal at each end (−1: fixed node or self-loop), off-diagonal
  const links = Int32Array.from(solvedLinks)
  const slotA = new Int32Array(flows.length).fill(-1)
  const slotB = new Int32Array(flows.length).fill(-1)
  const slotAB = new Int32Array(flows.length).fill(-1)
  for (const i of links) {
    const ua = unknown[from[i]!]!
    const ub = unknown[to[i]!]!
    if (ua === ub) continue
    if (ua >= 0) slotA[i] = system.diagonalSlot(ua)
    if (ub >= 0) slotB[i] = system.diagonalSlot(ub)
    if (edgeOfLink[i]! >= 0) slotAB[i] = system.edgeSlot(edgeOfLink[i]!)
  }
  const values = system.values

  let converged = false
  let diverged = false
  let iterations = 0
  let relaxation = 1
  let previousChange = Number.POSITIVE_INFINITY
  while (iterations < maxIterations) {
    iterations++
    system.clear()
    rhs.fill(0)
    table.evaluate(links, flows)
    const h = table.h
    const slope = table.slope
    for (let k = 0; k < links.length; k++) {
      const i = links[k]!
      const a = from[i]!
      const b = to[i]!
      // The first step from the uniform 1 m/s start uses the secant slope h/Q (a Picard step): the
      // tangent's half-step for quadratic laws costs, on our benchmark networks, one more iteration.
      const secant = iterations === 1 ? h[i]! / flows[i]! : 0
      const pi = secant > 0 && Number.isFinite(secant) ? 1 / secant : 1 / slope[i]!
      p[i] = pi
      const q = flows[i]! - pi * h[i]! + pi * (head[a]! - head[b]!)
      qt[i] = q
      const ua = unknown[a]!
      const ub = unknown[b]!
      if (ua >= 0) rhs[ua]! -= q
      if (ub >= 0) rhs[ub]! += q
      if (slotA[i]! >= 0) values[slotA[i]!]! += pi
      if (slotB[i]! >= 0) values[slotB[i]!]! += pi
      if (slotAB[i]! >= 0) values[slotAB[i]!]! -= pi
    }
    for (const pump of fixedFlows) {
      const q = flows[pump.index]!
      const ua = unknown[pump.from]!
      const ub = unknown[pump.to]!
      if (ua >= 0) rhs[ua]! -= q
      if (ub >= 0) rhs[ub]! += q
    }
    if (!system.factor()) {
      problems.push({ kind: 'not-converged', ids: [], message: 'the node matrix is not positive definite (a link has no usable resistance)' })
      diverged = true
      break
    }
    system.solve(rhs, headStep)
    for (let v = 0; v < nodeCount; v++) {
      const u = unknown[v]!
      step[v] = u >= 0 ? headStep[u]! : 0
    }

    let maxChange = 0
    let maxFlow = 0
    for (let k = 0; k < links.length; k++) {
      const i = links[k]!
      const target = qt[i]! + p[i]! * (step[from[i]!]! - step[to[i]!]!)
      const change = Math.abs(target - flows[i]!)
      if (change > maxChange) maxChange = change
      const next = flows[i]! + relaxation * (target - flows[i]!)
      flows[i] = next
      if (Math.abs(next) > maxFlow) maxFlow = Math.abs(next)
    }
    for (let v = 0; v < nodeCount; v++) head[v]! += relaxation * step[v]!
    for (const pump of fixedFlows) maxFlow = Math.max(maxFlow, Math.abs(flows[pump.index]!))
    if (!Number.isFinite(maxChange) || !Number.isFinite(maxFlow)) {
      problems.push({ kind: 'not-converged', ids: [], message: 'the iteration diverged; flows are not meaningful' })
      flows.fill(0)
      head.fill(0)
      diverged = true
      break
    }
    // Newton converges quadratically, so a tiny step that is not much smaller than the one before
    // means the flows have reached their rounding floor.
    const atRoundingFloor = maxChange <= ROUNDING_PLATEAU * maxFlow && maxChange >= 0.5 * previousChange
    // Remaining error after a full step, estimated from the contraction r of the last two steps
    // (geometric tail r/(1 − r); Newton's quadratic phase makes r tiny, so this is conservative).
    // A damped step leaves (1 − relaxation) of the step still to go, so only full steps qualify.
    const r = maxChange / previousChange
    // Only from the third step on (the first is a secant step) and once steps are small.
    const remaining = iterations > 2 && r < 1 && relaxation === 1 && maxChange <= 1e-4 * maxFlow ? (maxChange * r) / (1 - r) : Number.POSITIVE_INFINITY
    if (remaining <= tolerance * maxFlow || maxChange <= tolerance * maxFlow || maxChange < 1e-15 || atRoundingFloor) {
      converged = true
      break
    }
    // Damping once the first step has made the flows continuous: halve the step if Newton stalls.
    relaxation = iterations > 1 && maxChange > previousChange ? Math.max(0.25, relaxation / 2) : Math.min(1, relaxation * 2)
    previousChange = maxChange
  }
  if (!diverged) {
    if (largestImbalance(nodeCount, from, to, links, fixedFlows, flows) > CONTINUITY_SLACK) {
      balanceOnSpanningForest(nodeCount, from, to, solvedLinks, p, fixedFlows, prep.datumOf.values(), flows)
    }
    if (!converged) problems.push({ kind: 'not-converged', ids: [], message: `no convergence within ${maxIterations} iterations` })
  }
  // final losses, friction factors and Reynolds numbers at the reported flows
  table.evaluate(links, flows)
  return buildResult(network, prep, table, flows, head, converged, iterations)
}
