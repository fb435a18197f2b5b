// Connectivity checks that decide what the solver can meaningfully compute.

import { scratchMark, scratchRelease, takeInts, takeReals } from './scratch'

export class UnionFind {
  private parent: Int32Array
  /** in the scratch space (scratch.ts) */
  constructor(n: number) {
    this.parent = takeInts(n)
    for (let i = 0; i < n; i++) this.parent[i] = i
  }
  find(i: number): number {
    let r = i
    while (this.parent[r] !== r) r = this.parent[r]!
    while (this.parent[i] !== r) {
      const next = this.parent[i]!
      this.parent[i] = r
      i = next
    }
    return r
  }
  union(a: number, b: number): void {
    const ra = this.find(a)
    const rb = this.find(b)
    if (ra !== rb) this.parent[Math.max(ra, rb)] = Math.min(ra, rb)
  }
}

export interface FixedFlowLink {
  index: number
  from: number
  to: number
  flow: number
}

/**
 * A fixed-flow pump forces its flow out of one group of head-connected nodes and into another. Unless
 * every group's forced flows sum to zero the flow has no way back ("no return path"): continuity cannot
 * hold. Pumps touching an unbalanced group are switched off (flow 0), repeatedly, until all balance.
 * Returns the indices of the switched-off pumps.
 */
export function pumpsWithoutReturnPath(componentOf: Int32Array, pumps: FixedFlowLink[]): Set<number> {
  const off = new Set<number>()
  for (;;) {
    const net = new Map<number, number>()
    const scale = new Map<number, number>()
    for (const p of pumps) {
      if (off.has(p.index)) continue
      const a = componentOf[p.from]!
      const b = componentOf[p.to]!
      if (a === b) continue
      net.set(a, (net.get(a) ?? 0) - p.flow)
      net.set(b, (net.get(b) ?? 0) + p.flow)
      scale.set(a, (scale.get(a) ?? 0) + Math.abs(p.flow))
      scale.set(b, (scale.get(b) ?? 0) + Math.abs(p.flow))
    }
    const unbalanced = new Set<number>()
    for (const [c, q] of net) if (Math.abs(q) > 1e-12 * (scale.get(c) ?? 0)) unbalanced.add(c)
    if (unbalanced.size === 0) return off
    let changed = false
    for (const p of pumps) {
      if (off.has(p.index) || p.flow === 0) continue
      const a = componentOf[p.from]!
      const b = componentOf[p.to]!
      if (a !== b && (unbalanced.has(a) || unbalanced.has(b))) {
        off.add(p.index)
        changed = true
      }
    }
    if (!changed) return off
  }
}

/**
 * Largest node imbalance, as a fraction of the node's throughput or of the largest flow in the
 * network, whichever is larger (so that the closed end of a dead leg is judged against real flows).
 */
export function largestImbalance(
  nodeCount: number,
  from: Int32Array,
  to: Int32Array,
  links: ArrayLike<number>,
  fixedFlows: readonly FixedFlowLink[],
  flows: Float64Array,
): number {
  const mark = scratchMark()
  const net = takeReals(nodeCount)
  const through = takeReals(nodeCount)
  let largest = 0
  const count = links.length + fixedFlows.length
  for (let k = 0; k < count; k++) {
    const i = k < links.length ? links[k]! : fixedFlows[k - links.length]!.index
    const q = flows[i]!
    const aq = q < 0 ? -q : q
    const a = from[i]!
    const b = to[i]!
    net[a]! -= q
    net[b]! += q
    through[a]! += aq
    through[b]! += aq
    if (aq > largest) largest = aq
  }
  let worst = 0
  for (let v = 0; v < nodeCount; v++) {
    const e = Math.abs(net[v]!) / Math.max(through[v]!, largest, 1e-300)
    if (e > worst) worst = e
  }
  scratchRelease(mark)
  return worst
}

/**
 * Makes node continuity exact. The Newton update conserves flow only to rounding, and on links of very
 * low resistance (large p = dQ/dh) that rounding is what remains. Here the flows of a maximum-p spanning
 * forest are recomputed from continuity, leaves first, given all other flows; the forest takes exactly
 * the links whose head-based flows are least certain. Each tree is rooted at its group's fixed node,
 * which absorbs what is left (zero up to the rounding of a sum).
 */
export function balanceOnSpanningForest(
  nodeCount: number,
  from: Int32Array,
  to: Int32Array,
  solvedLinks: readonly number[],
  weight: Float64Array,
  fixedFlows: readonly FixedFlowLink[],
  roots: Iterable<number>,
  flows: Float64Array,
): void {
  // Kruskal on decreasing weight (ties: equal laws, where either choice is the same to rounding)
  const mark = scratchMark()
  const order = Int32Array.from(solvedLinks.filter(i => from[i] !== to[i]))
  order.sort((a, b) => weight[b]! - weight[a]! || a - b)
  const forest = new UnionFind(nodeCount)
  const inTree = takeInts(flows.length)
  const treeDegree = takeInts(nodeCount + 1)
  for (const i of order) {
    const a = from[i]!
    const b = to[i]!
    const ra = forest.find(a)
    const rb = forest.find(b)
    if (ra === rb) continue
    forest.union(ra, rb)
    inTree[i] = 1
    treeDegree[a + 1]! += 1
    treeDegree[b + 1]! += 1
  }
  // tree links by node, compressed rows
  for (let v = 0; v < nodeCount; v++) treeDegree[v + 1]! += treeDegree[v]!
  const fill = takeInts(nodeCount)
  fill.set(treeDegree.subarray(0, nodeCount))
  const treeLinks = takeInts(treeDegree[nodeCount]!)
  // net inflow at each node from everything that is not a tree link
  const balance = takeReals(nodeCount)
  for (const i of solvedLinks) {
    if (inTree[i]) {
      treeLinks[fill[from[i]!]!++] = i
      treeLinks[fill[to[i]!]!++] = i
      continue
    }
    balance[from[i]!]! -= flows[i]!
    balance[to[i]!]! += flows[i]!
  }
  for (const p of fixedFlows) {
    balance[p.from]! -= flows[p.index]!
    balance[p.to]! += flows[p.index]!
  }
  // breadth-first order from each root, then settle the tree links from the leaves up
  const visited = takeInts(nodeCount)
  const parentLink = takeInts(nodeCount).fill(-1)
  const sequence = takeInts(nodeCount)
  let length = 0
  for (const root of roots) {
    if (visited[root]) continue
    visited[root] = 1
    sequence[length++] = root
    for (let k = length - 1; k < length; k++) {
      const v = sequence[k]!
      for (let t = treeDegree[v]!; t < treeDegree[v + 1]!; t++) {
        const i = treeLinks[t]!
        const u = from[i] === v ? to[i]! : from[i]!
        if (visited[u]) continue
        visited[u] = 1
        parentLink[u] = i
        sequence[length++] = u
      }
    }
  }
  for (let k = length - 1; k >= 0; k--) {
    const v = sequence[k]!
    const i = parentLink[v]!
    if (i < 0) continue
    // choose the tree link's flow so that v balances; pass the effect on to the parent
    if (to[i] === v) {
      flows[i] = -balance[v]!
      balance[from[i]!]! -= flows[i]!
    } else {
      flows[i] = balance[v]!
      balance[to[i]!]! += flows[i]!
    }
    balance[v] = 0
  }
  scratchRelease(mark)
}
