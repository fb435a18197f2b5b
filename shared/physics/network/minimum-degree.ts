// Fill-reducing ordering for the sparse LDLᵀ factorisation: minimum degree on the explicit
// elimination graph (Tinney–Walker scheme 2). Hydraulic networks are near-planar and mostly chains,
// so the fill stays small and elimination on explicit lists is cheap.

/**
 * Minimum-degree elimination order of a graph with `n` vertices given as adjacency lists (consumed).
 * Vertices wait in doubly linked lists by current degree, so picking and re-filing cost O(1); lists
 * rather than sets for the adjacency, since degrees stay small in hydraulic networks.
 */
export function minimumDegreeOrder(n: number, adjacency: number[][]): Int32Array {
  const order = new Int32Array(n)
  const head = new Int32Array(n + 1).fill(-1)
  const next = new Int32Array(n)
  const prev = new Int32Array(n)
  const degree = new Int32Array(n)
  const unlink = (v: number) => {
    const p = prev[v]!
    const q = next[v]!
    if (p >= 0) next[p] = q
    else head[degree[v]!] = q
    if (q >= 0) prev[q] = p
  }
  const link = (v: number, d: number) => {
    degree[v] = d
    prev[v] = -1
    next[v] = head[d]!
    if (head[d]! >= 0) prev[head[d]!] = v
    head[d] = v
  }
  for (let v = n - 1; v >= 0; v--) link(v, adjacency[v]!.length)
  let min = 0
  for (let k = 0; k < n; k++) {
    while (head[min]! < 0) min++
    const v = head[min]!
    unlink(v)
    order[k] = v
    const neighbours = adjacency[v]!
    for (const u of neighbours) {
      const list = adjacency[u]!
      const at = list.indexOf(v)
      list[at] = list[list.length - 1]!
      list.pop()
    }
    // the neighbours of v become a clique
    for (let a = 0; a < neighbours.length; a++) {
      const u = neighbours[a]!
      const listU = adjacency[u]!
      for (let b = a + 1; b < neighbours.length; b++) {
        const w = neighbours[b]!
        if (!listU.includes(w)) {
          listU.push(w)
          adjacency[w]!.push(u)
        }
      }
    }
    for (const u of neighbours) {
      unlink(u)
      const d = adjacency[u]!.length
      link(u, d)
      if (d < min) min = d
    }
  }
  return order
}
