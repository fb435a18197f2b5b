// The circuit as a graph: nodes are ports, part centres (a pump has a suction and a discharge centre)
// and free hose ends; edges are hoses, the paths inside parts, and the pump. Built with graphlib, then
// copied to index arrays for the linear-time passes below.
import { Graph } from '@dagrejs/graphlib'
import type { CircuitModel, CompInfo, HoseInfo, PortInfo } from './model'

export type EdgeKind = 'hose' | 'internal' | 'pump'

export interface TopoEdge {
  name: string
  kind: EdgeKind
  v: number
  w: number
  hose?: HoseInfo
  port?: PortInfo
  comp?: CompInfo
}

export interface TopoGraph {
  /** the graphlib graph, for callers that want graphlib's algorithms; null when not asked for */
  graph: Graph | null
  nodeNames: string[]
  nodeIndex: Map<string, number>
  edges: TopoEdge[]
  /** per node, the indices of its edges */
  adjacency: number[][]
  /** node index of each part's centre, by part rank, and of each port, by port rank */
  centreIndex: Int32Array
  portIndex: Int32Array
  /** per edge: shut while the thermostat is closed */
  shutWhenCold: boolean[]
  /** per edge: shut by a heater valve turned off (flow solve only) */
  shutByValve: boolean[]
}

export const centreNode = (c: CompInfo) => `c:${c.comp.id}`
export const dischargeNode = (c: CompInfo) => `c:${c.comp.id}:out`
export const portNode = (p: PortInfo) => `p:${p.port.id}`
export const freeEndNode = (h: HoseInfo, end: 'from' | 'to') => `e:${h.hose.id}:${end}`

export type ValveState = 'open' | 'closed'

/**
 * Ports whose inside path is shut: a cold thermostat's valve (unless it has a bypass hole). A heater
 * valve turned off shuts only in the flow solve (withHeaterValves), not in the layout checks: the layout
 * must work with the valve open.
 */
export function isPathShut(port: PortInfo, state: ValveState, withHeaterValves = false): boolean {
  const comp = port.comp.comp
  if (comp.type === 'heater-valve') return withHeaterValves && comp.params.open === false
  if (comp.type === 'thermostat' && state === 'closed') {
    return comp.params.valvedPortId === port.port.id && comp.params.hasBypass !== true
  }
  return false
}

/** Pump ports on the discharge side are the outlets; everything else feeds the suction. */
export function pumpSideOf(port: PortInfo): 'suction' | 'discharge' {
  return port.port.role === 'outlet' ? 'discharge' : 'suction'
}

/**
 * Builds the graph once with every path open. `shutWhenCold` marks the thermostat paths that close
 * below the opening temperature and `shutByValve` the paths of heater valves turned off, so each state
 * is the same graph with some edges masked out.
 */
export function buildTopoGraph(model: CircuitModel, withGraphlib = true): TopoGraph {
  // One hose per port end and one path per port make every node pair unique: a simple graph will do.
  const graph = withGraphlib ? new Graph({ directed: false }) : null
  const nodeNames: string[] = []
  const nodeIndex = new Map<string, number>()
  const edges: TopoEdge[] = []
  const shutWhenCold: boolean[] = []
  const shutByValve: boolean[] = []
  const centreIndex = new Int32Array(model.components.length)
  const portIndex = new Int32Array(model.ports.length)
  const addNode = (name: string) => {
    nodeIndex.set(name, nodeNames.length)
    nodeNames.push(name)
    graph?.setNode(name)
    return nodeNames.length - 1
  }
  const addEdge = (e: TopoEdge, v: string, w: string, cold: boolean, valve: boolean) => {
    graph?.setEdge(v, w, edges.length)
    edges.push(e)
    shutWhenCold.push(cold)
    shutByValve.push(valve)
  }
  for (const c of model.components) {
    centreIndex[c.rank] = addNode(centreNode(c))
    if (c.comp.type === 'water-pump') addNode(dischargeNode(c))
    for (const p of c.ports) portIndex[p.rank] = addNode(portNode(p))
  }
  for (const h of model.hoses) {
    for (const end of [h.from, h.to]) if (!end.port) addNode(freeEndNode(h, end.name))
  }
  for (const c of model.components) {
    const isPump = c.comp.type === 'water-pump'
    const centre = centreNode(c)
    if (isPump) {
      const d = dischargeNode(c)
      addEdge({ name: `pump:${c.comp.id}`, kind: 'pump', comp: c, v: nodeIndex.get(centre)!, w: nodeIndex.get(d)! }, centre, d, false, false)
    }
    for (const p of c.ports) {
      const inner = isPump && pumpSideOf(p) === 'discharge' ? dischargeNode(c) : centre
      const pn = portNode(p)
      addEdge(
        { name: `i:${p.port.id}`, kind: 'internal', port: p, comp: c, v: nodeIndex.get(inner)!, w: nodeIndex.get(pn)! },
        inner, pn, isPathShut(p, 'closed'), isPathShut(p, 'open', true),
      )
    }
  }
  for (const h of model.hoses) {
    const a = h.from.port ? portNode(h.from.port) : freeEndNode(h, 'from')
    const b = h.to.port ? portNode(h.to.port) : freeEndNode(h, 'to')
    addEdge({ name: `h:${h.hose.id}`, kind: 'hose', hose: h, v: nodeIndex.get(a)!, w: nodeIndex.get(b)! }, a, b, false, false)
  }
  const adjacency: number[][] = nodeNames.map(() => [])
  edges.forEach((e, i) => {
    adjacency[e.v]!.push(i)
    if (e.w !== e.v) adjacency[e.w]!.push(i)
  })
  return { graph, nodeNames, nodeIndex, edges, adjacency, centreIndex, portIndex, shutWhenCold, shutByValve }
}

export interface EdgeClasses {
  /** per edge: true when removing it disconnects the graph, so no steady flow can pass it (false for removed edges) */
  isBridge: boolean[]
  /** per node: its 2-edge-connected class; nodes in one class lie on common closed loops */
  classOf: number[]
}

/**
 * Bridges by an iterative Tarjan low-link pass over the edges not in `removed`; parallel edges are
 * told apart by edge index.
 */
export function edgeClasses(t: TopoGraph, removed?: readonly boolean[]): EdgeClasses {
  const n = t.nodeNames.length
  const disc = new Int32Array(n).fill(-1)
  const low = new Int32Array(n)
  const isBridge: boolean[] = new Array(t.edges.length).fill(false)
  let time = 0
  const stackNode: number[] = []
  const stackEdge: number[] = []
  const stackPos: number[] = []
  for (let root = 0; root < n; root++) {
    if (disc[root] !== -1) continue
    disc[root] = low[root] = time++
    stackNode.push(root); stackEdge.push(-1); stackPos.push(0)
    while (stackNode.length > 0) {
      const top = stackNode.length - 1
      const v = stackNode[top]!
      const adj = t.adjacency[v]!
      const pos = stackPos[top]!
      if (pos < adj.length) {
        stackPos[top] = pos + 1
        const ei = adj[pos]!
        if (ei === stackEdge[top] || removed?.[ei]) continue
        const e = t.edges[ei]!
        const w = e.v === v ? e.w : e.v
        if (disc[w] === -1) {
          disc[w] = low[w] = time++
          stackNode.push(w); stackEdge.push(ei); stackPos.push(0)
        } else if (disc[w]! < low[v]!) low[v] = disc[w]!
      } else {
        stackNode.pop(); const via = stackEdge.pop()!; stackPos.pop()
        if (via >= 0) {
          const e = t.edges[via]!
          const parent = e.v === v ? e.w : e.v
          if (low[v]! < low[parent]!) low[parent] = low[v]!
          if (low[v]! > disc[parent]!) isBridge[via] = true
        }
      }
    }
  }
  const classOf: number[] = new Array(n).fill(-1)
  let next = 0
  const queue: number[] = []
  for (let s = 0; s < n; s++) {
    if (classOf[s] !== -1) continue
    classOf[s] = next
    queue.length = 0
    queue.push(s)
    for (let qi = 0; qi < queue.length; qi++) {
      const v = queue[qi]!
      for (const ei of t.adjacency[v]!) {
        if (isBridge[ei] || removed?.[ei]) continue
        const e = t.edges[ei]!
        const w = e.v === v ? e.w : e.v
        if (classOf[w] === -1) { classOf[w] = next; queue.push(w) }
      }
    }
    next++
  }
  return { isBridge, classOf }
}

/** The main pump: the first water pump in stable order (others are modelled as passages). */
export function mainPump(model: CircuitModel): CompInfo | undefined {
  return model.components.find((c) => c.comp.type === 'water-pump')
}
