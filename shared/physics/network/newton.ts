// The Newton iteration of the Global Gradient Algorithm, on dense arrays over the solved links (pipes,
// resistances, curve pumps) in their network order. See solve-network.ts for the method; this file is
// only its inner loops, kept small so that the JIT compiles each one well, with every array allocated
// once per solve.

import type { LinkTable } from './link-table'
import type { PreparedNetwork } from './prepare'
import { takeInts, takeReals } from './scratch'
import type { SparseSpdSolver } from './sparse-ldl'

/** relative flow change below which a step that no longer shrinks counts as converged to rounding */
const ROUNDING_PLATEAU = 1e-7

export interface IterationOutcome {
  converged: boolean
  diverged: boolean
  iterations: number
  message?: string
}

export class GradientIteration {
  /** flows of the solved links, m³/s, by position in prep.solvedLinks */
  readonly q: Float64Array
  /** 1/(dh/dQ) of the last step, by position: the weights of the final balancing */
  readonly p: Float64Array
  /** heads relative to the reference head, by node; fixed nodes keep theirs */
  readonly head: Float64Array
  private readonly qt: Float64Array
  private readonly rhs: Float64Array
  /** head steps by unknown, with one more entry that stays 0 for fixed nodes */
  private readonly headStep: Float64Array
  private readonly nodeA: Int32Array
  private readonly nodeB: Int32Array
  /**
   * each end's unknown head, as its place in the solver's elimination order (so that the solves need
   * no reordering), or the always-zero extra entry for a fixed node
   */
  private readonly unknownA: Int32Array
  private readonly unknownB: Int32Array
  /** the same place for every node */
  private readonly stepOfNode: Int32Array
  /** matrix slots: diagonal at each end and the off-diagonal (−1: none) */
  private readonly slotA: Int32Array
  private readonly slotB: Int32Array
  private readonly slotAB: Int32Array

  constructor(
    private readonly prep: PreparedNetwork,
    private readonly system: SparseSpdSolver,
    private readonly table: LinkTable,
    initial: Float64Array,
  ) {
    const { solvedLinks, from, to, unknown, edgeOfLink, unknownCount: m } = prep
    const n = solvedLinks.length
    // scratch space: the iteration does not outlive a solve
    this.q = takeReals(n)
    this.p = takeReals(n)
    this.qt = takeReals(n)
    this.head = takeReals(prep.fixedHead.length)
    this.rhs = takeReals(m)
    this.headStep = takeReals(m + 1)
    const ints = takeInts(7 * n)
    this.nodeA = ints.subarray(0, n)
    this.nodeB = ints.subarray(n, 2 * n)
    this.unknownA = ints.subarray(2 * n, 3 * n)
    this.unknownB = ints.subarray(3 * n, 4 * n)
    this.slotA = ints.subarray(4 * n, 5 * n)
    this.slotB = ints.subarray(5 * n, 6 * n)
    this.slotAB = ints.subarray(6 * n, 7 * n)
    this.stepOfNode = takeInts(this.head.length)
    for (let v = 0; v < this.head.length; v++) {
      if (unknown[v]! < 0) this.head[v] = prep.fixedHead[v]!
      this.stepOfNode[v] = unknown[v]! >= 0 ? system.permutedIndex(unknown[v]!) : m
    }
    for (let k = 0; k < n; k++) {
      const i = solvedLinks[k]!
      this.q[k] = initial[i]!
      const a = from[i]!
      const b = to[i]!
      this.nodeA[k] = a
      this.nodeB[k] = b
      const ua = unknown[a]!
      const ub = unknown[b]!
      this.unknownA[k] = ua >= 0 ? system.permutedIndex(ua) : m
      this.unknownB[k] = ub >= 0 ? system.permutedIndex(ub) : m
      const self = ua === ub
      this.slotA[k] = !self && ua >= 0 ? system.diagonalSlot(ua) : -1
      this.slotB[k] = !self && ub >= 0 ? system.diagonalSlot(ub) : -1
      this.slotAB[k] = !self && edgeOfLink[i]! >= 0 ? system.edgeSlot(edgeOfLink[i]!) : -1
    }
  }

  run(maxIterations: number, tolerance: number, fixedFlowOf: (index: number) => number): IterationOutcome {
    let iterations = 0
    let relaxation = 1
    let previousChange = Number.POSITIVE_INFINITY
    let fixedMax = 0
    let fixedSum = 0
    for (const pump of this.prep.fixedFlows) {
      const size = Math.abs(fixedFlowOf(pump.index))
      fixedMax = Math.max(fixedMax, size)
      fixedSum += size
    }
    while (iterations < maxIterations) {
      iterations++
      this.table.evaluate(this.q)
      this.assemble(iterations === 1, fixedFlowOf)
      if (!this.system.factor()) {
        return { converged: false, diverged: true, iterations, message: 'the node matrix is not positive definite (a link has no usable resistance)' }
      }
      this.system.solvePermuted(this.rhs, this.headStep)
      const { maxChange, sumChange } = this.update(relaxation)
      const { largest, sum } = this.flowSize()
      const maxFlow = Math.max(largest, fixedMax)
      const sumFlow = sum + fixedSum
      if (!Number.isFinite(maxChange) || !Number.isFinite(maxFlow)) {
        this.q.fill(0)
        this.head.fill(0)
        return { converged: false, diverged: true, iterations, message: 'the iteration diverged; flows are not meaningful' }
      }
      // Converged when a full step changed the flows by at most the tolerance: the sum of the changes
      // against the sum of the flows, EPANET's test. Newton converges quadratically there, so the
      // error left is of the order of the square of the step. A damped step leaves (1 − relaxation)
      // of it still to go, so only full steps qualify.
      // A tiny step not much smaller than the one before: the flows are at their rounding floor
      // (reachable only with a tolerance below ~1e-7).
      const atRoundingFloor = maxChange <= ROUNDING_PLATEAU * maxFlow && maxChange >= 0.5 * previousChange
      // The friction factors of this step must have been exact too, to well below the flow error
      // the tolerance leaves (see LinkTable.rootError).
      const exactLaws = this.table.rootError <= tolerance * tolerance * maxFlow
      if (exactLaws && ((relaxation === 1 && sumChange <= tolerance * sumFlow) || maxChange < 1e-15 || atRoundingFloor)) {
        return { converged: true, diverged: false, iterations }
      }
      // Damping once the first step has made the flows continuous: halve the step if Newton stalls.
      relaxation = iterations > 1 && maxChange > previousChange ? Math.max(0.25, relaxation / 2) : Math.min(1, relaxation * 2)
      previousChange = maxChange
    }
    return { converged: false, diverged: false, iterations }
  }

  /**
   * The node system of one step in correction form: p = 1/(dh/dQ), Q̃ = Q − p·h(Q) + p·ΔH, the
   * right-hand side the continuity residual of Q̃ (and the forced flows). The first step from the
   * uniform 1 m/s start uses the secant slope h/Q (a Picard step): the tangent's half-step for
   * quadratic laws costs, on our benchmark networks, one more iteration.
   */
  private assemble(secantStep: boolean, fixedFlowOf: (index: number) => number): void {
    const { q, p, qt, rhs, head, nodeA, nodeB, unknownA, unknownB, slotA, slotB, slotAB } = this
    const { h, slope } = this.table
    const values = this.system.values
    const m = this.prep.unknownCount
    values.fill(0)
    rhs.fill(0)
    const n = q.length
    for (let k = 0; k < n; k++) {
      const hk = h[k]!
      const qk = q[k]!
      let pk = 1 / slope[k]!
      if (secantStep) {
        const secant = hk / qk
        if (secant > 0 && secant < Number.POSITIVE_INFINITY) pk = 1 / secant
      }
      p[k] = pk
      const target = qk - pk * hk + pk * (head[nodeA[k]!]! - head[nodeB[k]!]!)
      qt[k] = target
      const ua = unknownA[k]!
      const ub = unknownB[k]!
      if (ua < m) rhs[ua]! -= target
      if (ub < m) rhs[ub]! += target
      const sa = slotA[k]!
      if (sa >= 0) values[sa]! += pk
      const sb = slotB[k]!
      if (sb >= 0) values[sb]! += pk
      const sab = slotAB[k]!
      if (sab >= 0) values[sab]! -= pk
    }
    const { stepOfNode } = this
    for (const pump of this.prep.fixedFlows) {
      const qf = fixedFlowOf(pump.index)
      const ua = stepOfNode[pump.from]!
      const ub = stepOfNode[pump.to]!
      if (ua < m) rhs[ua]! -= qf
      if (ub < m) rhs[ub]! += qf
    }
  }

  /** Applies the (relaxed) step to flows and heads; returns the largest and summed flow change of the full step. */
  private update(relaxation: number): { maxChange: number; sumChange: number } {
    const { q, p, qt, headStep, unknownA, unknownB, head } = this
    const n = q.length
    let maxChange = 0
    let sumChange = 0
    for (let k = 0; k < n; k++) {
      const target = qt[k]! + p[k]! * (headStep[unknownA[k]!]! - headStep[unknownB[k]!]!)
      const delta = target - q[k]!
      const change = delta < 0 ? -delta : delta
      if (change > maxChange) maxChange = change
      sumChange += change
      q[k] = q[k]! + relaxation * delta
    }
    const { stepOfNode } = this
    const m = this.prep.unknownCount
    for (let v = 0; v < head.length; v++) {
      const u = stepOfNode[v]!
      if (u < m) head[v]! += relaxation * headStep[u]!
    }
    return { maxChange, sumChange }
  }

  private flowSize(): { largest: number; sum: number } {
    const q = this.q
    let largest = 0
    let sum = 0
    for (let k = 0; k < q.length; k++) {
      const a = q[k]! < 0 ? -q[k]! : q[k]!
      if (a > largest) largest = a
      sum += a
    }
    return { largest, sum }
  }
}
