// Branches: runs of network links between junctions (nodes where three or more links meet). Flow is
// the same all along a branch, so one figure describes it. Each is named by the parts along it in the
// direction of flow and listed in the order the coolant reaches it, so that the branches leaving a
// junction can be read as a split of what arrived there.
import type { AnalysisContext } from '../context'
import type { CompInfo, HoseInfo } from '../model'
import { STANDARD_GRAVITY, type NetworkResult } from '../physics'
import type { BuiltNetwork } from './network'
import type { BranchFlow, BranchKind } from './types'

interface Chain {
  /** nodes n0 … nk and links l1 … lk, link j joining nodes j−1 and j, in the direction of flow */
  nodes: number[]
  links: number[]
  flowLpm: number
}

const VENT_TYPES = new Set(['expansion-tank', 'deaeration-pot', 'pressure-cap'])

interface Row {
  row: BranchFlow
  pump: boolean
  upstream: number
  downstream: number
  firstRank: number
}

export function branchesOf(ctx: AnalysisContext, built: BuiltNetwork, result: NetworkResult, pumpFlow: number): BranchFlow[] {
  const chains = chainsOf(built, result)
  const { network, nodePart, linkHose, pumpLink } = built
  // head at each node, kPa above the reference: pressure plus ρ·g·z
  const rhoG = (network.fluid.densityKgM3 * STANDARD_GRAVITY) / 1000
  const head = new Float64Array(network.nodes.length)
  for (let v = 0; v < head.length; v++) {
    const node = network.nodes[v]!
    head[v] = (result.nodePressureKpa[node.id] ?? 0) + rhoG * node.elevationM
  }
  const suction = built.networkNodeOf[ctx.graph.partNode[ctx.pump!.rank]!]!
  const discharge = built.networkNodeOf[ctx.graph.dischargeNode]!
  const rows: Row[] = []
  for (const chain of chains) {
    const first = chain.nodes[0]!
    const last = chain.nodes[chain.nodes.length - 1]!
    const fromPart = nodePart[first]!
    const toPart = nodePart[last]!
    // the parts in flow order, each once (the pump's two nodes are one part); those between the ends
    let label = fromPart.comp.label
    let previous = fromPart
    const interior: CompInfo[] = []
    for (let k = 1; k < chain.nodes.length; k++) {
      const c = nodePart[chain.nodes[k]!]!
      if (c === previous) continue
      label += ` → ${c.comp.label}`
      previous = c
      if (k < chain.nodes.length - 1 && c !== fromPart && c !== toPart) interior.push(c)
    }
    const hoses: HoseInfo[] = []
    let hasPump = false
    let firstRank = Number.MAX_SAFE_INTEGER
    let bypass = false
    for (const l of chain.links) {
      if (l === pumpLink) { hasPump = true; continue }
      const h = linkHose[l]!
      hoses.push(h)
      if (h.rank < firstRank) firstRank = h.rank
      if (!bypass && leavesThermostatBypass(h)) bypass = true
    }
    const kind = branchKind(interior, hasPump, bypass, last === suction, first === discharge)
    const tags: string[] = new Array(hoses.length)
    const hoseIds: string[] = new Array(hoses.length)
    for (let k = 0; k < hoses.length; k++) { tags[k] = hoses[k]!.tag; hoseIds[k] = hoses[k]!.hose.id }
    rows.push({
      row: {
        kind, label, fromComponentId: fromPart.comp.id, toComponentId: toPart.comp.id,
        componentIds: interior.map((c) => c.comp.id), hoseIds, tags,
        flowLpm: chain.flowLpm, shareOfPump: pumpFlow > 0 ? chain.flowLpm / pumpFlow : 0,
      },
      pump: hasPump, upstream: head[first]!, downstream: head[last]!, firstRank,
    })
  }
  return inFlowOrder(rows)
}

/**
 * Pump first, then from the highest head down (at the upstream end, then the downstream end), so that
 * a split follows what feeds it; the first hose's rank settles ties. The keys are read into one array
 * first, for a sort that does not chase pointers.
 */
function inFlowOrder(rows: Row[]): BranchFlow[] {
  const n = rows.length
  const keys = new Float64Array(4 * n)
  for (let i = 0; i < n; i++) {
    const r = rows[i]!
    keys[4 * i] = r.pump ? 0 : 1
    keys[4 * i + 1] = -r.upstream
    keys[4 * i + 2] = -r.downstream
    keys[4 * i + 3] = r.firstRank
  }
  const order = Array.from({ length: n }, (_, i) => i)
  order.sort((a, b) => {
    const ka = 4 * a
    const kb = 4 * b
    return keys[ka]! - keys[kb]! || keys[ka + 1]! - keys[kb + 1]! || keys[ka + 2]! - keys[kb + 2]! || keys[ka + 3]! - keys[kb + 3]!
  })
  return order.map((i) => rows[i]!.row)
}

function branchKind(interior: CompInfo[], hasPump: boolean, bypass: boolean, intoPump: boolean, fromPump: boolean): BranchKind {
  if (hasPump) return 'pump'
  let vent = false
  let heater = false
  for (const c of interior) {
    const t = c.comp.type
    if (t === 'radiator') return 'radiator'
    if (t === 'heater-core') heater = true
    else if (VENT_TYPES.has(t)) vent = true
  }
  if (heater) return 'heater'
  if (bypass) return 'bypass'
  if (vent) return 'vent'
  if (intoPump) return 'return'
  if (fromPump) return 'feed'
  return 'run'
}

/** A bypass leaves a thermostat by its outlet that the valve does not shut. */
function leavesThermostatBypass(h: HoseInfo): boolean {
  return isBypassOutlet(h.from.port) || isBypassOutlet(h.to.port)
}

function isBypassOutlet(port: HoseInfo['from']['port']): boolean {
  const t = port!.comp.comp
  return t.type === 'thermostat' && port!.port.id !== t.params.valvedPortId && port!.port.role === 'outlet'
}

/**
 * The chains between junctions, walked from each junction in node order (and, for a loop with no
 * junction at all, from its first node), then turned to run with the flow.
 */
function chainsOf(built: BuiltNetwork, result: NetworkResult): Chain[] {
  const { linkFrom, linkTo } = built
  const nodeCount = built.network.nodes.length
  const linkCount = linkFrom.length
  // links at each node, compressed rows
  const start = new Int32Array(nodeCount + 1)
  for (let i = 0; i < linkCount; i++) { start[linkFrom[i]! + 1]!++; start[linkTo[i]! + 1]!++ }
  for (let v = 0; v < nodeCount; v++) start[v + 1]! += start[v]!
  const fill = start.slice(0, nodeCount)
  const incident = new Int32Array(2 * linkCount)
  for (let i = 0; i < linkCount; i++) { incident[fill[linkFrom[i]!]!++] = i; incident[fill[linkTo[i]!]!++] = i }
  const degree = (v: number) => start[v + 1]! - start[v]!
  const used = new Uint8Array(linkCount)
  const chains: Chain[] = []
  const flowOf = (l: number) => result.links[l]!.flowLpm
  const walk = (from: number, firstLink: number) => {
    const nodes = [from]
    const links: number[] = []
    let v = from
    let link = firstLink
    let flow = 0
    for (;;) {
      used[link] = 1
      links.push(link)
      const q = Math.abs(flowOf(link))
      if (q > flow) flow = q
      v = linkFrom[link] === v ? linkTo[link]! : linkFrom[link]!
      nodes.push(v)
      if (degree(v) !== 2 || v === from) break
      const next = incident[start[v]!] === link ? incident[start[v]! + 1]! : incident[start[v]!]!
      if (used[next]) break
      link = next
    }
    // the flow along the walk: positive when the first link runs from the walk's start
    const along = linkFrom[links[0]!] === from ? flowOf(links[0]!) : -flowOf(links[0]!)
    if (along < 0) {
      nodes.reverse()
      links.reverse()
    }
    chains.push({ nodes, links, flowLpm: flow })
  }
  for (let v = 0; v < nodeCount; v++) {
    if (degree(v) === 2) continue
    for (let a = start[v]!; a < start[v + 1]!; a++) if (!used[incident[a]!]) walk(v, incident[a]!)
  }
  for (let l = 0; l < linkCount; l++) if (!used[l]) walk(linkFrom[l]!, l) // a loop without junctions
  return chains
}
