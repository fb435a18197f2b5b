// The loop tree: the circuit's closed loops and what hangs off them, as a graphlib graph. Every
// 2-edge-connected class of the part graph (thermostat open) is a node, every bridge hose an edge;
// since a bridge is the only link between its two sides, the graph is a forest. The dead-leg check
// walks it from the pump's loop. It is small: a sound circuit is one big loop with a few stubs (a
// tank line, a drain), so building it costs next to nothing however large the circuit is.
import { Graph } from '@dagrejs/graphlib'
import type { AnalysisContext } from '../context'
import type { GraphEdge } from '../graph'

export interface LoopNode {
  /** the open state's loop class */
  loop: number
}

/** graphlib node name of a loop class */
export const loopName = (loop: number) => `loop:${loop}`

/**
 * The bridge tree: a node per loop class that a bridge touches (and the pump's, the root), an edge
 * per bridge hose. Every class is a closed loop or a single part; what hangs off the pump's loop by a
 * bridge is a branch that leads nowhere, unless something in it is meant to be a dead end.
 */
export function buildLoopTree(ctx: AnalysisContext, root: number): Graph<undefined, LoopNode, GraphEdge> {
  const { isBridge, classOf } = ctx.open
  const tree = new Graph<undefined, LoopNode, GraphEdge>({ directed: false })
  tree.setNode(loopName(root), { loop: root })
  for (const e of ctx.graph.edges) {
    if (!isBridge[e.index]) continue
    const a = classOf[e.v]!
    const b = classOf[e.w]!
    tree.setNode(loopName(a), { loop: a })
    tree.setNode(loopName(b), { loop: b })
    tree.setEdge(loopName(a), loopName(b), e)
  }
  return tree
}
