// Fill-reducing ordering for the sparse LDLᵀ factorisation: minimum degree on the explicit
// elimination graph (Tinney–Walker scheme 2). Hydraulic networks are near-planar and mostly chains,
// so the fill stays small and elimination on explicit lists is cheap.

import { scratchMark, scratchRelease, takeInts } from './scratch'

/**
 * Minimum-degree elimination order of a graph with `n` vertices, given as compressed rows
 * (neighbours of v at adjacent[start[v] … start[v + 1]), no duplicates, no self-loops).
 *
 * Vertices wait in doubly linked lists by current degree, so picking and re-filing cost O(1). Each
 * vertex's neighbour list lives in one Int32Array with some room to grow; a list that outgrows its
 * room moves to the end (degrees stay small in hydraulic networks, so the scans are short).
 */
export function minimumDegreeOrder(n: number, start: Int32Array, adjacent: Int32Array, order: Int32Array = new Int32Array(n)): Int32Array {
  const slack = 4
  const poolSize = start[n]! + slack * n + 16
  const mark = scratchMark()
  const head = takeInts(n + 1).fill(-1)
  const next = takeInts(n)
  const prev = takeInts(n)
  const offset = takeInts(n)
  const length = takeInts(n)
  const room = takeInts(n)
  let pool = takeInts(poolSize)
  let used = 0
  for (let v = 0; v < n; v++) {
    const from = start[v]!
    const d = start[v + 1]! - from
    offset[v] = used
    length[v] = d
    room[v] = d + slack
    for (let p = 0; p < d; p++) pool[used + p] = adjacent[from + p]!
    used += d + slack
  }
  const unlink = (v: number) => {
    const p = prev[v]!
    const q = next[v]!
    if (p >= 0) next[p] = q
    else head[length[v]!] = q
    if (q >= 0) prev[q] = p
  }
  const file = (v: number) => {
    const d = length[v]!
    prev[v] = -1
    next[v] = head[d]!
    if (head[d]! >= 0) prev[head[d]!] = v
    head[d] = v
  }
  const append = (v: number, w: number) => {
    if (length[v] === room[v]) {
      const grown = 2 * room[v]! + 2
      if (used + grown > pool.length) {
        const bigger = new Int32Array(2 * (used + grown))
        bigger.set(pool.subarray(0, used))
        pool = bigger
      }
      pool.copyWithin(used, offset[v]!, offset[v]! + length[v]!)
      offset[v] = used
      room[v] = grown
      used += grown
    }
    pool[offset[v]! + length[v]!] = w
    length[v]! += 1
  }
  for (let v = n - 1; v >= 0; v--) file(v)
  let min = 0
  for (let k = 0; k < n; k++) {
    while (head[min]! < 0) min++
    const v = head[min]!
    unlink(v)
    order[k] = v
    const vo = offset[v]!
    const vd = length[v]!
    // take v out of its neighbours' lists
    for (let a = 0; a < vd; a++) {
      const u = pool[vo + a]!
      unlink(u)
      const uo = offset[u]!
      const last = uo + length[u]! - 1
      for (let p = uo; p <= last; p++) {
        if (pool[p] === v) {
          pool[p] = pool[last]!
          break
        }
      }
      length[u]! -= 1
    }
    // the neighbours of v become a clique
    for (let a = 0; a < vd; a++) {
      const u = pool[offset[v]! + a]!
      for (let b = a + 1; b < vd; b++) {
        const w = pool[offset[v]! + b]!
        const uo = offset[u]!
        const ue = uo + length[u]!
        let present = false
        for (let p = uo; p < ue; p++) {
          if (pool[p] === w) {
            present = true
            break
          }
        }
        if (!present) {
          append(u, w)
          append(w, u)
        }
      }
    }
    for (let a = 0; a < vd; a++) {
      const u = pool[offset[v]! + a]!
      file(u)
      if (length[u]! < min) min = length[u]!
    }
    length[v] = 0
  }
  scratchRelease(mark)
  return order
}
