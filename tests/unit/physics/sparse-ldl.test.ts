// The sparse LDLᵀ solver against a dense Gaussian elimination on random SPD node matrices.

import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { SparseSpdSolver } from '#shared/physics/network/sparse-ldl'
import { seededRandom } from '../../reference/network-generators'

function denseSolve(a: number[][], b: number[]): number[] {
  const n = b.length
  const m = a.map((row, i) => [...row, b[i]!])
  for (let c = 0; c < n; c++) {
    let p = c
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r]![c]!) > Math.abs(m[p]![c]!)) p = r
    ;[m[c], m[p]] = [m[p]!, m[c]!]
    for (let r = c + 1; r < n; r++) {
      const f = m[r]![c]! / m[c]![c]!
      for (let k = c; k <= n; k++) m[r]![k]! -= f * m[c]![k]!
    }
  }
  const x = new Array<number>(n).fill(0)
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r]![n]!
    for (let k = r + 1; k < n; k++) s -= m[r]![k]! * x[k]!
    x[r] = s / m[r]![r]!
  }
  return x
}

/** A weighted graph Laplacian plus a positive diagonal (the node matrix of a grounded network). */
function randomSystem(seed: number, n: number, extra: number) {
  const random = seededRandom(seed)
  const pairs: Array<[number, number]> = []
  for (let v = 1; v < n; v++) pairs.push([v, Math.floor(random() * v)])
  for (let k = 0; k < extra; k++) pairs.push([Math.floor(random() * n), Math.floor(random() * n)]) // may repeat or self-loop
  const solver = new SparseSpdSolver(n, Int32Array.from(pairs, p => p[0]), Int32Array.from(pairs, p => p[1]))
  const dense = Array.from({ length: n }, () => new Array<number>(n).fill(0))
  pairs.forEach(([i, j], k) => {
    if (i === j) return
    const w = 10 ** (random() * 6 - 3) // weights over six decades, like hydraulic conductances
    solver.addEdge(k, -w)
    solver.addDiagonal(i, w)
    solver.addDiagonal(j, w)
    dense[i]![j]! -= w
    dense[j]![i]! -= w
    dense[i]![i]! += w
    dense[j]![j]! += w
  })
  solver.addDiagonal(0, 1) // the grounding link
  dense[0]![0]! += 1
  return { solver, dense, random }
}

describe('sparse LDLᵀ solver', () => {
  it('matches dense elimination on random grounded Laplacians with duplicate and self-loop entries', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 2 ** 30 }), fc.integer({ min: 1, max: 60 }), fc.integer({ min: 0, max: 80 }), (seed, n, extra) => {
      const { solver, dense, random } = randomSystem(seed, n, extra)
      expect(solver.factor()).toBe(true)
      const b = Array.from({ length: n }, () => random() - 0.5)
      const x = new Float64Array(n)
      solver.solve(Float64Array.from(b), x)
      const reference = denseSolve(dense, b)
      const scale = Math.max(...reference.map(Math.abs), 1e-300)
      reference.forEach((r, i) => expect(Math.abs(x[i]! - r)).toBeLessThan(1e-7 * scale))
    }), { numRuns: 200 })
  })

  it('refactors after new values (the Newton loop reuses the symbolic factorisation)', () => {
    const { solver, dense } = randomSystem(7, 30, 20)
    solver.factor()
    solver.clear()
    expect(solver.factor()).toBe(false) // all-zero matrix is not positive definite
    const again = randomSystem(7, 30, 20)
    expect(again.solver.factor()).toBe(true)
    expect(dense.length).toBe(30)
  })

  it('keeps fill small on a long chain with cross-links (near-linear cost)', () => {
    const n = 5000
    const pairs: Array<[number, number]> = []
    for (let v = 1; v < n; v++) pairs.push([v - 1, v])
    for (let v = 0; v + 5 < n; v += 3) pairs.push([v, v + 5])
    const solver = new SparseSpdSolver(n, Int32Array.from(pairs, p => p[0]), Int32Array.from(pairs, p => p[1]))
    expect(solver.factorNonZeros).toBeLessThan(6 * n)
  })
})
