// The circuit as a part-level multigraph: one node per part (the main water pump has two, suction and
// discharge), one per free hose end; one edge per hose and one for the main pump. Two hoses between
// the same two parts are parallel edges. Ports are not nodes: a port joins one hose to one part, so it
// sits on the hose's edge and adds no branch. Loops, bridges and dead legs come out the same as on a
// graph with a node per port (that graph is this one with each hose split into three edges in a row,
// and a stub per unjoined port).
//
// Held in typed arrays (compressed rows of incident edges): the bridge and loop passes run on every
// analysis, once per valve state, and stay linear in the circuit's size. The bridge tree over the
// loops, which the dead-leg check walks, is a graphlib graph (checks/loopTree.ts).
import type { CircuitModel, CompInfo, HoseInfo, PortInfo } from './model'

export type ValveState = 'open' | 'closed'

export interface GraphNode {
  /** the part id, `<id>/discharge` for the pump's outlet side, `<hose id>/<end>` for a free end */
  name: string
  index: number
  comp: CompInfo | null
  /** a free hose end */
  freeEnd: { hose: HoseInfo; end: 'from' | 'to' } | null
}

export interface GraphEdge {
  /** the hose id, or `<pump id>/pump` */
  name: string
  index: number
  kind: 'hose' | 'pump'
  /** node indices: the hose's `from` end and `to` end; the pump's suction and discharge */
  v: number
  w: number
  hose: HoseInfo | null
}

export interface CircuitGraph {
  nodes: GraphNode[]
  edges: GraphEdge[]
  /** edges at node v: incident[start[v] … start[v + 1]) */
  start: Int32Array
  incident: Int32Array
  /** node of each part, by part rank (the suction side for the main pump) */
  partNode: Int32Array
  /** the main pump: its discharge node and pump edge (−1 without a pump) */
  dischargeNode: number
  pumpEdge: number
  /** edge of each hose, by hose rank */
  hoseEdge: Int32Array
  pump: CompInfo | undefined
  /** per edge: shut while the thermostat is closed */
  shutWhenCold: Uint8Array
  /** per edge: shut by a heater valve turned off (flow solve only) */
  shutByValve: Uint8Array
}

/** The main pump: the first water pump in stable order. Others are passages, like any part. */
export function mainPump(model: CircuitModel): CompInfo | undefined {
  return model.components.find((c) => c.comp.type === 'water-pump')
}

/** Pump ports on the discharge side are the outlets; everything else feeds the suction. */
export function pumpSideOf(port: PortInfo): 'suction' | 'discharge' {
  return port.port.role === 'outlet' ? 'discharge' : 'suction'
}

/**
 * Ports whose inside path is shut: a cold thermostat's valve (unless it has a bypass hole). A heater
 * valve turned off shuts only in the flow solve (withHeaterValves), not in the layout checks: the
 * layout must work with the valve open.
 */
export function isPathShut(port: PortInfo, state: ValveState, withHeaterValves = false): boolean {
  const comp = port.comp.comp
  if (comp.type === 'heater-valve') return withHeaterValves && comp.params.open === false
  if (comp.type === 'thermostat' && state === 'closed') {
    return comp.params.valvedPortId === port.port.id && comp.params.hasBypass !== true
  }
  return false
}

export function buildCircuitGraph(model: CircuitModel): CircuitGraph {
  const pump = mainPump(model)
  const nodes: GraphNode[] = []
  const edges: GraphEdge[] = []
  const partNode = new Int32Array(model.components.length)
  const addNode = (name: string, comp: CompInfo | null, freeEnd: GraphNode['freeEnd']) => {
    const node: GraphNode = { name, index: nodes.length, comp, freeEnd }
    nodes.push(node)
    return node.index
  }
  let dischargeNode = -1
  for (const c of model.components) {
    partNode[c.rank] = addNode(c.comp.id, c, null)
    if (c === pump) dischargeNode = addNode(`${c.comp.id}/discharge`, c, null)
  }
  const endNode = (h: HoseInfo, end: 'from' | 'to'): number => {
    const port = h[end].port
    if (!port) return addNode(`${h.hose.id}/${end}`, null, { hose: h, end })
    return port.comp === pump && pumpSideOf(port) === 'discharge' ? dischargeNode : partNode[port.comp.rank]!
  }
  const addEdge = (name: string, kind: GraphEdge['kind'], v: number, w: number, hose: HoseInfo | null) => {
    const edge: GraphEdge = { name, index: edges.length, kind, v, w, hose }
    edges.push(edge)
    return edge.index
  }
  const pumpEdge = pump ? addEdge(`${pump.comp.id}/pump`, 'pump', partNode[pump.rank]!, dischargeNode, null) : -1
  const hoseEdge = new Int32Array(model.hoses.length)
  for (const h of model.hoses) hoseEdge[h.rank] = addEdge(h.hose.id, 'hose', endNode(h, 'from'), endNode(h, 'to'), h)
  const shutWhenCold = new Uint8Array(edges.length)
  const shutByValve = new Uint8Array(edges.length)
  for (const h of model.hoses) {
    for (const end of [h.from, h.to]) {
      if (!end.port) continue
      const e = hoseEdge[h.rank]!
      if (isPathShut(end.port, 'closed')) shutWhenCold[e] = 1
      if (isPathShut(end.port, 'open', true)) shutByValve[e] = 1
    }
  }
  // incident edges per node, in edge order (a self-loop is listed once)
  const start = new Int32Array(nodes.length + 1)
  for (const e of edges) { start[e.v + 1]!++; if (e.w !== e.v) start[e.w + 1]!++ }
  for (let v = 0; v < nodes.length; v++) start[v + 1]! += start[v]!
  const fill = start.slice(0, nodes.length)
  const incident = new Int32Array(start[nodes.length]!)
  for (const e of edges) { incident[fill[e.v]!++] = e.index; if (e.w !== e.v) incident[fill[e.w]!++] = e.index }
  return { nodes, edges, start, incident, partNode, dischargeNode, pumpEdge, hoseEdge, pump, shutWhenCold, shutByValve }
}

/** The graph in one valve state: which edges are there, which are bridges, and the loop classes. */
export interface StateGraph {
  circuit: CircuitGraph
  /** per edge: not there in this state */
  removed: Uint8Array
  /** per edge: removing it would disconnect its ends, so no steady flow can pass it (0 for removed edges) */
  isBridge: Uint8Array
  /** per node: its 2-edge-connected class; nodes in one class lie on common closed loops */
  classOf: Int32Array
  classCount: number
}

/**
 * Bridges and 2-edge-connected classes in one iterative depth-first pass, skipping removed edges
 * (Tarjan's low-link method). A node whose low-link equals its own discovery time closes a class: it
 * and the nodes found after it that are still open. Parallel edges are told apart by edge index, so
 * two hoses between the same parts form a loop.
 */
export function stateGraph(circuit: CircuitGraph, removed: Uint8Array): StateGraph {
  const { nodes, edges, start, incident } = circuit
  const n = nodes.length
  const disc = new Int32Array(n).fill(-1)
  const low = new Int32Array(n)
  const classOf = new Int32Array(n).fill(-1)
  const isBridge = new Uint8Array(edges.length)
  // the depth-first stack: node, the edge it was reached by, how far through its edges
  const stackNode = new Int32Array(n)
  const stackVia = new Int32Array(n)
  const stackPos = new Int32Array(n)
  const open = new Int32Array(n)
  let openTop = 0
  let time = 0
  let classes = 0
  for (let root = 0; root < n; root++) {
    if (disc[root] !== -1) continue
    let top = 0
    disc[root] = low[root] = time++
    open[openTop++] = root
    stackNode[0] = root
    stackVia[0] = -1
    stackPos[0] = start[root]!
    while (top >= 0) {
      const v = stackNode[top]!
      const pos = stackPos[top]!
      if (pos < start[v + 1]!) {
        stackPos[top] = pos + 1
        const ei = incident[pos]!
        if (ei === stackVia[top] || removed[ei]) continue
        const e = edges[ei]!
        const w = e.v === v ? e.w : e.v
        if (disc[w] === -1) {
          disc[w] = low[w] = time++
          open[openTop++] = w
          top++
          stackNode[top] = w
          stackVia[top] = ei
          stackPos[top] = start[w]!
        } else if (disc[w]! < low[v]!) low[v] = disc[w]!
        continue
      }
      // v is done: it closes a class if nothing below it reaches above it
      if (low[v] === disc[v]) {
        let u: number
        do {
          u = open[--openTop]!
          classOf[u] = classes
        } while (u !== v)
        classes++
        if (stackVia[top]! >= 0) isBridge[stackVia[top]!] = 1
      }
      top--
      if (top >= 0) {
        const parent = stackNode[top]!
        if (low[v]! < low[parent]!) low[parent] = low[v]!
      }
    }
  }
  return { circuit, removed, isBridge, classOf, classCount: classes }
}
