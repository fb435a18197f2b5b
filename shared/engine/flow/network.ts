// The circuit as a physics Network. Nodes are part centres (the main pump has a suction and a
// discharge node); each hose becomes one pipe between the centres of the parts it joins, carrying the
// losses of the paths into and out of those parts (referred to the hose bore) on top of its bends; the
// pump is a pump link. Ports are not nodes here: a port joins exactly one hose to one part, so it adds
// no junction, and leaving it out makes the network about three times smaller. The expansion tank (or
// cap) holds the reference pressure.
import { circulates } from '../checks/circulation'
import type { AnalysisContext } from '../context'
import { stateGraph, type StateGraph, type ValveState } from '../graph'
import type { CompInfo, HoseInfo, PortInfo } from '../model'
import type { FluidState, Network, NetworkLink, NetworkNode } from '../physics'
import { kAtBore, portBoreM, portPathK, roughnessFor, routeBendK, THERMOSTAT_BLEED_HOLE } from './resistances'

export interface BuiltNetwork {
  network: Network
  /** the state's graph (heater valves as set) */
  state: StateGraph
  /** per network link: the hose it stands for (null for the pump) */
  linkHose: Array<HoseInfo | null>
  /** per network link: K of the part paths at its from end and at its to end, referred to the hose bore */
  fromEndK: Float64Array
  toEndK: Float64Array
  /** per network link: its end nodes, as network node indices */
  linkFrom: Int32Array
  linkTo: Int32Array
  /** per network node: the part it stands for */
  nodePart: CompInfo[]
  /** per graph node: its network node, −1 when not in the network */
  networkNodeOf: Int32Array
  /** per hose rank: its network link, −1 when it carries no flow in this state */
  linkOfHose: Int32Array
  /** the pump link's index, −1 when the pump is not in the network */
  pumpLink: number
  defaulted: string[]
  referenceText: string
}

const REFERENCE_TYPES = ['expansion-tank', 'pressure-cap', 'deaeration-pot'] as const

export function operatingTemperatureC(ctx: AnalysisContext): number {
  const s = ctx.doc.circuit.settings.coolant
  if (s?.operatingTempC !== undefined) return s.operatingTempC
  const t = ctx.model.components.find((c) => c.comp.type === 'thermostat')
  return t && t.comp.type === 'thermostat' ? t.comp.params.fullOpenTempC : 90
}

/** Why a flow solve would mean nothing, or null when it can run. */
export function flowSkipReason(ctx: AnalysisContext): string | null {
  if (ctx.doc.circuit.kind !== 'coolant') return 'A fuel circuit\'s flows are estimated line by line (series model): see the fuel figures.'
  if (!circulates(ctx)) return 'Not solved: coolant cannot circulate through the pump, engine and radiator (see no-circulation).'
  return null
}

function flowState(ctx: AnalysisContext, state: ValveState): StateGraph {
  const base = state === 'open' ? ctx.open : ctx.closed
  const valves = ctx.graph.shutByValve
  if (!valves.includes(1)) return base
  const removed = base.removed.slice()
  for (let i = 0; i < removed.length; i++) if (valves[i]) removed[i] = 1
  return stateGraph(ctx.graph, removed)
}

export function buildNetwork(ctx: AnalysisContext, state: ValveState, fluid: FluidState): BuiltNetwork {
  const g = flowState(ctx, state)
  const { nodes: graphNodes, edges } = ctx.graph
  const pump = ctx.pump!
  const loop = g.classOf[ctx.graph.partNode[pump.rank]!]!
  const networkNodeOf = new Int32Array(graphNodes.length).fill(-1)
  const nodes: NetworkNode[] = []
  const nodePart: CompInfo[] = []
  const useNode = (v: number): number => {
    if (networkNodeOf[v] === -1) {
      const node = graphNodes[v]!
      networkNodeOf[v] = nodes.length
      nodes.push({ id: node.name, elevationM: node.comp!.comp.position.z / 1000 })
      nodePart.push(node.comp!)
    }
    return networkNodeOf[v]!
  }
  const defaulted = new Set<string>()
  const links: NetworkLink[] = []
  const linkHose: Array<HoseInfo | null> = []
  const fromK: number[] = []
  const toK: number[] = []
  const linkFrom: number[] = []
  const linkTo: number[] = []
  const linkOfHose = new Int32Array(ctx.model.hoses.length).fill(-1)
  let pumpLink = -1
  const rho = fluid.densityKgM3
  const coolant = ctx.doc.circuit.settings.coolant!
  const endK = (p: PortInfo): number => {
    const path = portPathK(p, rho)
    if (path.defaulted) defaulted.add(p.comp.comp.id)
    const comp = p.comp.comp
    const bleed = state === 'closed' && comp.type === 'thermostat' && comp.params.valvedPortId === p.port.id && comp.params.hasBypass
    return path.k + (bleed ? kAtBore(THERMOSTAT_BLEED_HOLE, portBoreM(p), rho) : 0)
  }
  for (const e of edges) {
    if (g.removed[e.index] || g.isBridge[e.index] || g.classOf[e.v] !== loop) continue
    if (e.v === e.w) continue // a hose looping back to the same part: no pressure across it, no flow
    const fromNode = useNode(e.v)
    const toNode = useNode(e.w)
    linkFrom.push(fromNode)
    linkTo.push(toNode)
    // the same string objects as the node ids, so that the solver's lookups compare by reference
    const from = nodes[fromNode]!.id
    const to = nodes[toNode]!.id
    if (e.kind === 'pump') {
      const s = coolant.pump
      pumpLink = links.length
      links.push({
        kind: 'pump', id: e.name, from, to,
        pump: s.mode === 'fixed' ? { fixedFlowLpm: s.flowLpm } : { curve: s.points.map((p) => ({ ...p })) },
      })
      linkHose.push(null)
      fromK.push(0)
      toK.push(0)
      continue
    }
    const h = e.hose!
    const d = h.hose.insideDiameterMm / 1000
    const ka = endK(h.from.port!)
    const kb = endK(h.to.port!)
    linkOfHose[h.rank] = links.length
    links.push({
      kind: 'pipe', id: e.name, from, to, lengthM: Math.max(h.lengthMm, 1) / 1000, diameterM: d,
      roughnessM: roughnessFor(h.hose.material), minorK: routeBendK(h.from.point, h.hose.params.route, h.to.point, d) + ka + kb,
    })
    linkHose.push(h)
    fromK.push(ka)
    toK.push(kb)
  }
  const { node, text } = referenceNode(ctx, g, networkNodeOf)
  return {
    network: { nodes, links, referenceNode: node, referencePressureKpa: 0, fluid },
    state: g, linkHose, fromEndK: Float64Array.from(fromK), toEndK: Float64Array.from(toK),
    linkFrom: Int32Array.from(linkFrom), linkTo: Int32Array.from(linkTo), nodePart, networkNodeOf, linkOfHose, pumpLink,
    defaulted: [...defaulted].sort((x, y) => ctx.model.rankOf(x) - ctx.model.rankOf(y)), referenceText: text,
  }
}

/**
 * The tank's node, or the nearest part on the loop that the tank's line reaches: breadth first, level
 * by level, the lowest-ranked part of the first level on the loop.
 */
function referenceNode(ctx: AnalysisContext, g: StateGraph, networkNodeOf: Int32Array): { node: string; text: string } {
  let tank: CompInfo | undefined
  for (const t of REFERENCE_TYPES) { tank = ctx.model.components.find((c) => c.comp.type === t); if (tank) break }
  const pump = ctx.pump!
  const { nodes, edges, start, incident } = ctx.graph
  if (!tank) return { node: nodes[ctx.graph.partNode[pump.rank]!]!.name, text: `${pump.comp.label} inlet (the circuit has no tank or cap)` }
  const origin = ctx.graph.partNode[tank.rank]!
  if (networkNodeOf[origin]! >= 0) return { node: nodes[origin]!.name, text: tank.comp.label }
  const seen = new Uint8Array(nodes.length)
  seen[origin] = 1
  let level = [origin]
  while (level.length > 0) {
    const next: number[] = []
    let best = -1
    for (const v of level) {
      for (let a = start[v]!; a < start[v + 1]!; a++) {
        const e = edges[incident[a]!]!
        if (g.removed[e.index]) continue
        const w = e.v === v ? e.w : e.v
        if (seen[w]) continue
        seen[w] = 1
        next.push(w)
        if (networkNodeOf[w]! >= 0 && (best < 0 || networkNodeRank(ctx, w) < networkNodeRank(ctx, best))) best = w
      }
    }
    if (best >= 0) {
      const part = nodes[best]!.comp!
      return { node: nodes[best]!.name, text: `${part.comp.label}, where the line from ${tank.comp.label} joins the loop` }
    }
    level = next
  }
  return { node: nodes[ctx.graph.partNode[pump.rank]!]!.name, text: `${pump.comp.label} inlet (${tank.comp.label} is not joined to the loop)` }
}

/** Stable order of graph nodes that stand for parts: part rank, the pump's discharge after its suction. */
function networkNodeRank(ctx: AnalysisContext, v: number): number {
  const node = ctx.graph.nodes[v]!
  return 2 * node.comp!.rank + (v === ctx.graph.dischargeNode ? 1 : 0)
}
