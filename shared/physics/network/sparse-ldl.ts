// Sparse LDLᵀ factorisation for the symmetric positive definite node matrix of the network solver.
//
// Ordering: minimum degree (minimum-degree.ts);
// hydraulic networks are near-planar and mostly chains, so the fill stays small and a direct solve
// costs close to O(n) per Newton step, unlike conjugate gradients whose iteration count grows with
// the length of a chain.
// Factorisation: the up-looking LDLᵀ of T. A. Davis, "Algorithm 849: A concise sparse Cholesky
// factorization package", ACM TOMS 31(4), 2005 — elimination tree, then row patterns of L found by
// walking the tree from the non-zeros of each row of A.

import { minimumDegreeOrder } from './minimum-degree'
import { scratchMark, scratchRelease, takeInts, takeReals } from './scratch'

export class SparseSpdSolver {
  readonly n: number
  /** values of the permuted upper triangle in column-compressed order; fill through the index maps */
  readonly values: Float64Array
  private readonly perm: Int32Array
  private readonly pinv: Int32Array
  private readonly ap: Int32Array
  private readonly ai: Int32Array
  private readonly diagonalPosition: Int32Array
  private readonly edgePosition: Int32Array
  private readonly lp: Int32Array
  private readonly li: Int32Array
  private readonly lx: Float64Array
  private readonly d: Float64Array
  /** 1/d, so that the factorisation's inner loop multiplies instead of divides */
  private readonly invD: Float64Array
  private readonly y: Float64Array
  private readonly rowStart: Int32Array
  private readonly rowPattern: Int32Array
  private readonly fillAt: Int32Array
  private readonly work: Float64Array

  /**
   * Off-diagonal entry k joins vertices edgeI[k] and edgeJ[k]; duplicates share a position and
   * i = j is ignored. With `inScratch` the solver's arrays are taken from the scratch space
   * (scratch.ts): for a caller that releases it only when done with the solver.
   */
  constructor(n: number, edgeI: Int32Array, edgeJ: Int32Array, inScratch = false) {
    // (locals throughout: the loops run before the object has its final shape)
    this.n = n
    const edgeCount = edgeI.length
    const mark = scratchMark()
    // neighbours in compressed rows, duplicates and self-loops dropped
    const start = takeInts(n + 1)
    const end = takeInts(n)
    for (let k = 0; k < edgeCount; k++) {
      if (edgeI[k] === edgeJ[k]) continue
      start[edgeI[k]! + 1]! += 1
      start[edgeJ[k]! + 1]! += 1
    }
    for (let v = 0; v < n; v++) start[v + 1]! += start[v]!
    end.set(start.subarray(0, n))
    const adjacent = takeInts(start[n]!)
    for (let k = 0; k < edgeCount; k++) {
      const i = edgeI[k]!
      const j = edgeJ[k]!
      if (i === j) continue
      let seen = false // a repeated pair: the rows are short, a scan will do
      for (let p = start[i]!; p < end[i]!; p++) {
        if (adjacent[p] === j) {
          seen = true
          break
        }
      }
      if (seen) continue
      adjacent[end[i]!++] = j
      adjacent[end[j]!++] = i
    }
    // close the gaps left by repeated pairs, so that each row is exactly its neighbours
    let packed = 0
    for (let v = 0; v < n; v++) {
      const from = start[v]!
      const to = end[v]!
      start[v] = packed
      for (let p = from; p < to; p++) adjacent[packed++] = adjacent[p]!
    }
    start[n] = packed
    end.set(start.subarray(1, n + 1))
    const perm = minimumDegreeOrder(n, start, adjacent, takeInts(n))
    const pinv = takeInts(n)
    for (let k = 0; k < n; k++) pinv[perm[k]!] = k

    // Upper triangle of P·A·Pᵀ by columns: column c holds rows r < c, then the diagonal.
    const ap = takeInts(n + 1)
    for (let v = 0; v < n; v++) {
      const c = pinv[v]!
      let count = 1
      for (let q = start[v]!; q < end[v]!; q++) if (pinv[adjacent[q]!]! < c) count++
      ap[c + 1] = count
    }
    for (let c = 0; c < n; c++) ap[c + 1]! += ap[c]!
    const entries = ap[n]!
    const ai = takeInts(entries)
    const diagonalPosition = takeInts(n)
    for (let v = 0; v < n; v++) {
      const c = pinv[v]!
      let p = ap[c]!
      for (let q = start[v]!; q < end[v]!; q++) {
        const r = pinv[adjacent[q]!]!
        if (r < c) ai[p++] = r
      }
      ai[p] = c
      diagonalPosition[v] = p
    }

    // Symbolic factorisation: elimination tree and column counts of L.
    const parent = takeInts(n)
    const flag = takeInts(n)
    const lnz = takeInts(n)
    for (let k = 0; k < n; k++) {
      parent[k] = -1
      flag[k] = k
      for (let p = ap[k]!; p < ap[k + 1]!; p++) {
        for (let i = ai[p]!; i < k && flag[i] !== k; i = parent[i]!) {
          if (parent[i] === -1) parent[i] = k
          lnz[i]! += 1
          flag[i] = k
        }
      }
    }
    let nonZeros = 0
    for (let k = 0; k < n; k++) nonZeros += lnz[k]!

    // What the factorisation keeps: one buffer of integers, one of reals.
    const keptSize = 4 * n + (n + 1) * 3 + entries + edgeCount + 2 * nonZeros
    const kept = inScratch ? takeInts(keptSize) : new Int32Array(keptSize)
    let at = 0
    const keep = (size: number) => kept.subarray(at, (at += size))
    this.perm = keep(n)
    this.perm.set(perm)
    this.pinv = keep(n)
    this.pinv.set(pinv)
    this.ap = keep(n + 1)
    this.ap.set(ap)
    this.ai = keep(entries)
    this.ai.set(ai)
    this.diagonalPosition = keep(n)
    this.diagonalPosition.set(diagonalPosition)
    const edgePosition = keep(edgeCount)
    for (let k = 0; k < edgeCount; k++) {
      const i = edgeI[k]!
      const j = edgeJ[k]!
      if (i === j) {
        edgePosition[k] = -1
        continue
      }
      const a = pinv[i]!
      const b = pinv[j]!
      const r = a < b ? a : b
      const c = a < b ? b : a
      let p = ap[c]!
      while (ai[p] !== r) p++
      edgePosition[k] = p
    }
    this.edgePosition = edgePosition
    const lp = keep(n + 1)
    for (let k = 0; k < n; k++) lp[k + 1] = lp[k]! + lnz[k]!
    // Row patterns of L (Davis' ereach from the non-zeros of each row of A) and the row indices of
    // each column of L, in the order the numeric factorisation fills them.
    const li = keep(nonZeros)
    const rowStart = keep(n + 1)
    const rowPattern = keep(nonZeros)
    const fillAt = keep(n)
    const pattern = lnz // free again
    flag.fill(-1)
    for (let k = 0; k < n; k++) fillAt[k] = lp[k]!
    let count = 0
    for (let k = 0; k < n; k++) {
      let top = n
      flag[k] = k
      for (let p = ap[k]!; p < ap[k + 1]!; p++) {
        let i = ai[p]!
        let len = 0
        for (; flag[i] !== k; i = parent[i]!) {
          pattern[len++] = i
          flag[i] = k
        }
        while (len > 0) pattern[--top] = pattern[--len]!
      }
      rowStart[k] = count
      for (; top < n; top++) {
        const i = pattern[top]!
        rowPattern[count++] = i
        li[fillAt[i]!++] = k
      }
    }
    rowStart[n] = count
    if (!inScratch) scratchRelease(mark)

    const reals = inScratch ? takeReals(entries + nonZeros + 4 * n) : new Float64Array(entries + nonZeros + 4 * n)
    this.values = reals.subarray(0, entries)
    this.lp = lp
    this.li = li
    this.lx = reals.subarray(entries, entries + nonZeros)
    this.rowStart = rowStart
    this.rowPattern = rowPattern
    this.fillAt = fillAt
    this.d = reals.subarray(entries + nonZeros, entries + nonZeros + n)
    this.y = reals.subarray(entries + nonZeros + n, entries + nonZeros + 2 * n)
    this.work = reals.subarray(entries + nonZeros + 2 * n, entries + nonZeros + 3 * n)
    this.invD = reals.subarray(entries + nonZeros + 3 * n, entries + nonZeros + 4 * n)
  }

  /** Non-zeros of L, a measure of fill. */
  get factorNonZeros(): number {
    return this.lp[this.n]!
  }

  clear(): void {
    this.values.fill(0)
  }

  /** where A[v][v] lives in `values` (for callers that assemble in a hot loop) */
  diagonalSlot(vertex: number): number {
    return this.diagonalPosition[vertex]!
  }

  /** where the entry of edge k lives in `values`, −1 for a self-loop */
  edgeSlot(edgeIndex: number): number {
    return this.edgePosition[edgeIndex]!
  }

  addDiagonal(vertex: number, value: number): void {
    this.values[this.diagonalPosition[vertex]!]! += value
  }

  addEdge(edgeIndex: number, value: number): void {
    const p = this.edgePosition[edgeIndex]!
    if (p >= 0) this.values[p]! += value
  }

  /**
   * Numeric LDLᵀ of the current values; false when a pivot is not positive (matrix not SPD).
   * Row k of L has the precomputed pattern rowPattern[rowStart[k]…], in an order where every entry
   * is final before it is used (the elimination-tree order of Davis' up-looking method).
   */
  factor(): boolean {
    const { n, ap, ai, values, lp, li, lx, d, invD, y, rowStart, rowPattern, fillAt } = this
    fillAt.set(lp.subarray(0, n))
    for (let k = 0; k < n; k++) {
      for (let p = ap[k]!; p < ap[k + 1]!; p++) y[ai[p]!]! += values[p]!
      let dk = y[k]!
      y[k] = 0
      for (let t = rowStart[k]!; t < rowStart[k + 1]!; t++) {
        const i = rowPattern[t]!
        const yi = y[i]!
        y[i] = 0
        const end = fillAt[i]!
        for (let p = lp[i]!; p < end; p++) y[li[p]!]! -= lx[p]! * yi
        const lki = yi * invD[i]!
        dk -= lki * yi
        lx[end] = lki
        fillAt[i] = end + 1
      }
      d[k] = dk
      invD[k] = 1 / dk
      if (!(dk > 0)) {
        y.fill(0)
        return false
      }
    }
    return true
  }

  /** Position of a vertex in the elimination order: solvePermuted takes and gives vectors in this order. */
  permutedIndex(vertex: number): number {
    return this.pinv[vertex]!
  }

  /** Solves A·x = b with b and x in elimination order (see permutedIndex); x may be b. */
  solvePermuted(b: Float64Array, x: Float64Array): void {
    const { n, lp, li, lx, invD } = this
    if (x !== b) x.set(b.subarray(0, n))
    for (let j = 0; j < n; j++) {
      const xj = x[j]!
      for (let p = lp[j]!; p < lp[j + 1]!; p++) x[li[p]!]! -= lx[p]! * xj
    }
    for (let j = 0; j < n; j++) x[j]! *= invD[j]!
    for (let j = n - 1; j >= 0; j--) {
      let s = x[j]!
      for (let p = lp[j]!; p < lp[j + 1]!; p++) s -= lx[p]! * x[li[p]!]!
      x[j] = s
    }
  }

  /** Solves A·x = b with the last factorisation; b and x are in the caller's vertex numbering. */
  solve(b: Float64Array, x: Float64Array): void {
    const { n, perm, work } = this
    for (let k = 0; k < n; k++) work[k] = b[perm[k]!]!
    this.solvePermuted(work, work)
    for (let k = 0; k < n; k++) x[perm[k]!] = work[k]!
  }
}
