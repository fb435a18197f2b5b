// The part graph's bridge and loop pass, and the loop tree built from it, against their definitions.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { randomCircuit } from '#shared/demo'
import { buildContext } from '#shared/engine/context'
import { buildLoopTree, loopName } from '#shared/engine/checks/loopTree'
import type { CircuitGraph } from '#shared/engine/graph'
import { valid } from './fixtures'

/** Nodes reachable from `from` without the edges in `skip` (by index) or in `removed`. */
function reachable(g: CircuitGraph, from: number, skip: number, removed: Uint8Array): Set<number> {
  const seen = new Set([from])
  const queue = [from]
  for (let i = 0; i < queue.length; i++) {
    const v = queue[i]!
    for (let a = g.start[v]!; a < g.start[v + 1]!; a++) {
      const e = g.edges[g.incident[a]!]!
      if (e.index === skip || removed[e.index]) continue
      const w = e.v === v ? e.w : e.v
      if (!seen.has(w)) { seen.add(w); queue.push(w) }
    }
  }
  return seen
}

const circuits = fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), rungs: fc.integer({ min: 1, max: 5 }), faults: fc.boolean(), tidy: fc.boolean() })

describe('bridges and loop classes', () => {
  it('an edge is a bridge exactly when taking it out separates its ends; the classes are what is left joined', () => {
    fc.assert(fc.property(circuits, (opts) => {
      const ctx = buildContext(valid(randomCircuit(opts)))
      for (const state of [ctx.open, ctx.closed]) {
        const g = ctx.graph
        for (const e of g.edges) {
          if (state.removed[e.index]) { expect(state.isBridge[e.index]).toBe(0); continue }
          const separated = e.v !== e.w && !reachable(g, e.v, e.index, state.removed).has(e.w)
          expect(state.isBridge[e.index] === 1).toBe(separated)
        }
        // two nodes share a class when a path of non-bridges joins them
        const noBridges = Uint8Array.from(state.removed, (r, i) => r || state.isBridge[i]!)
        for (let v = 0; v < g.nodes.length; v++) {
          const joined = reachable(g, v, -1, noBridges)
          for (let w = 0; w < g.nodes.length; w++) expect(state.classOf[w] === state.classOf[v]).toBe(joined.has(w))
        }
      }
    }), { numRuns: 30 })
  })

  it('the loop tree in graphlib has a node per class a bridge touches and an edge per bridge, and no cycle', () => {
    fc.assert(fc.property(circuits, (opts) => {
      const ctx = buildContext(valid(randomCircuit(opts)))
      const root = ctx.open.classOf[ctx.graph.partNode[ctx.pump!.rank]!]!
      const tree = buildLoopTree(ctx, root)
      const bridges = ctx.graph.edges.filter((e) => ctx.open.isBridge[e.index])
      expect(tree.edgeCount()).toBe(bridges.length)
      for (const e of bridges) {
        expect(tree.hasEdge(loopName(ctx.open.classOf[e.v]!), loopName(ctx.open.classOf[e.w]!))).toBe(true)
      }
      expect(tree.hasNode(loopName(root))).toBe(true)
      // a forest: as many edges as nodes less the number of its pieces
      const pieces = new Set<string>()
      const seen = new Set<string>()
      for (const start of tree.nodes()) {
        if (seen.has(start)) continue
        pieces.add(start)
        const stack = [start]
        seen.add(start)
        while (stack.length) for (const w of tree.neighbors(stack.pop()!) ?? []) if (!seen.has(w)) { seen.add(w); stack.push(w) }
      }
      expect(tree.edgeCount()).toBe(tree.nodeCount() - pieces.size)
    }), { numRuns: 30 })
  })
})
