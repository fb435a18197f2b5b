// The circuit as a physics Network. Nodes are part centres (a pump has a suction and a discharge node);
// each hose becomes one pipe between the centres of the parts it joins, carrying the losses of the paths
// into and out of those parts (referred to the hose bore) on top of its bends; the pump is a pump link.
// Ports are not nodes here: a port joins exactly one hose to one part, so it adds no junction, and
// leaving it out makes the network about three times smaller. The expansion tank (or cap) holds the
// reference pressure.
import { circulates } from '../checks/circulation'
import type { AnalysisContext, StateGraph } from '../context'
import { centreNode, dischargeNode, edgeClasses, pumpSideOf, type ValveState } from '../graph'
import type { CompInfo, PortInfo } from '../model'
import type { FluidState, Network, NetworkLink, NetworkNode } from '../physics'
import { kAtBore, portBoreM, portPathK, roughnessFor, routeBendK, THERMOSTAT_BLEED_HOLE } from './resistances'

export interface BuiltNetwork {
  network: Network
  /** the state's graph (heater valves as set) */
  graph: StateGraph
  /** per graph edge: carries flow in this state (on the pump's loop) */
  flowing: boolean[]
  /** per network node id: the part it stands for */
  partAt: Map<string, CompInfo>
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
  if (ctx.doc.circuit.kind !== 'coolant') return 'Flow is solved for coolant circuits only so far.'
  if (!circulates(ctx)) return 'Not solved: coolant cannot circulate through the pump, engine and radiator (see no-circulation).'
  return null
}

/** The node a port's hose reaches: the part's centre, or a pump's discharge side. */
export function innerNodeOf(p: PortInfo): string {
  return p.comp.comp.type === 'water-pump' && pumpSideOf(p) === 'discharge' ? dischargeNode(p.comp) : centreNode(p.comp)
}

function stateGraph(ctx: AnalysisContext, state: ValveState): StateGraph {
  const base = state === 'open' ? ctx.open : ctx.closed
  const topo = base.topo
  if (!topo.shutByValve.some(Boolean)) return base
  const removed = topo.edges.map((_, i) => base.removed[i]! || topo.shutByValve[i]!)
  return { topo, classes: edgeClasses(topo, removed), removed }
}

export function buildNetwork(ctx: AnalysisContext, state: ValveState, fluid: FluidState): BuiltNetwork {
  const graph = stateGraph(ctx, state)
  const { topo, classes, removed } = graph
  const pump = ctx.pump!
  const loop = classes.classOf[topo.nodeIndex.get(centreNode(pump))!]!
  const flowing = topo.edges.map((e, i) => !removed[i] && !classes.isBridge[i] && classes.classOf[e.v] === loop)

  const partAt = new Map<string, CompInfo>()
  const nodes: NetworkNode[] = []
  const useNode = (name: string, c: CompInfo) => {
    if (partAt.has(name)) return
    partAt.set(name, c)
    nodes.push({ id: name, elevationM: c.comp.position.z / 1000 })
  }
  const defaulted = new Set<string>()
  const links: NetworkLink[] = []
  const rho = fluid.densityKgM3
  const coolant = ctx.doc.circuit.settings.coolant!
  const endK = (p: PortInfo): number => {
    const path = portPathK(p, rho)
    if (path.defaulted) defaulted.add(p.comp.comp.id)
    const comp = p.comp.comp
    const bleed = state === 'closed' && comp.type === 'thermostat' && comp.params.valvedPortId === p.port.id && comp.params.hasBypass
    return path.k + (bleed ? kAtBore(THERMOSTAT_BLEED_HOLE, portBoreM(p), rho) : 0)
  }
  topo.edges.forEach((e, i) => {
    if (!flowing[i]) return
    if (e.kind === 'pump') {
      useNode(centreNode(pump), pump)
      useNode(dischargeNode(pump), pump)
      const s = coolant.pump
      links.push({
        kind: 'pump', id: e.name, from: centreNode(pump), to: dischargeNode(pump),
        pump: s.mode === 'fixed' ? { fixedFlowLpm: s.flowLpm } : { curve: s.points.map((p) => ({ ...p })) },
      })
      return
    }
    if (e.kind !== 'hose') return
    const h = e.hose!
    const a = h.from.port!
    const b = h.to.port!
    const from = innerNodeOf(a)
    const to = innerNodeOf(b)
    if (from === to) return // a hose looping back to the same part: no pressure across it, no flow
    useNode(from, a.comp)
    useNode(to, b.comp)
    const d = h.hose.insideDiameterMm / 1000
    links.push({
      kind: 'pipe', id: e.name, from, to, lengthM: Math.max(h.lengthMm, 1) / 1000, diameterM: d,
      roughnessM: roughnessFor(h.hose.material), minorK: routeBendK(h.points, d) + endK(a) + endK(b),
    })
  })
  const { node, text } = referenceNode(ctx, graph, partAt)
  return {
    network: { nodes, links, referenceNode: node, referencePressureKpa: 0, fluid },
    graph, flowing, partAt, defaulted: [...defaulted].sort((x, y) => ctx.model.rankOf(x) - ctx.model.rankOf(y)), referenceText: text,
  }
}

/** The tank's centre, or the first part on the loop that the tank's line reaches. */
function referenceNode(ctx: AnalysisContext, g: StateGraph, used: Map<string, CompInfo>): { node: string; text: string } {
  let tank: CompInfo | undefined
  for (const t of REFERENCE_TYPES) { tank = ctx.model.components.find((c) => c.comp.type === t); if (tank) break }
  const pump = ctx.pump!
  if (!tank) return { node: centreNode(pump), text: `${pump.comp.label} inlet (the circuit has no tank or cap)` }
  const start = g.topo.nodeIndex.get(centreNode(tank))!
  const seen = new Set([start])
  const queue = [start]
  for (let i = 0; i < queue.length; i++) {
    const v = queue[i]!
    const name = g.topo.nodeNames[v]!
    if (used.has(name)) {
      return { node: name, text: v === start ? tank.comp.label : `${used.get(name)!.comp.label}, where the line from ${tank.comp.label} joins the loop` }
    }
    for (const ei of g.topo.adjacency[v]!) {
      if (g.removed[ei]) continue
      const e = g.topo.edges[ei]!
      const w = e.v === v ? e.w : e.v
      if (!seen.has(w)) { seen.add(w); queue.push(w) }
    }
  }
  return { node: centreNode(pump), text: `${pump.comp.label} inlet (${tank.comp.label} is not joined to the loop)` }
}
