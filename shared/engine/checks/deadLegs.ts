// Dead legs: a hose on a bridge of the circuit graph can carry no steady flow (what enters a branch
// that leads nowhere must also leave by the same way), so a branch hanging off the loop is dead unless
// it was built to end there: a bleed, drain, vent, fill or overflow line, or a tank.
import { makeFinding, type AnalysisContext, type Check } from '../context'
import { centreNode, type TopoGraph } from '../graph'
import { hoseName, portName, type CompInfo, type HoseInfo, type PortInfo } from '../model'
import type { Finding } from '../report'

/** Parts a branch may lead to and stop: their whole purpose is a dead end. */
export const TERMINAL_TYPES = new Set(['bleed-valve', 'drain', 'overflow-bottle', 'expansion-tank', 'deaeration-pot', 'pressure-cap'])
const TERMINAL_ROLES = new Set(['vent', 'fill', 'drain'])

interface NodeMeta {
  comp?: CompInfo
  port?: PortInfo
  hoseEnd?: HoseInfo
}

/** What each graph node stands for, by index. */
export function nodeMeta(ctx: AnalysisContext, topo: TopoGraph): NodeMeta[] {
  const meta: NodeMeta[] = topo.nodeNames.map(() => ({}))
  for (const c of ctx.model.components) {
    meta[topo.centreIndex[c.rank]!]!.comp = c
    for (const p of c.ports) meta[topo.portIndex[p.rank]!]!.port = p
  }
  for (const h of ctx.model.hoses) {
    for (const end of ['from', 'to'] as const) {
      const i = topo.nodeIndex.get(`e:${h.hose.id}:${end}`)
      if (i !== undefined) meta[i]!.hoseEnd = h
    }
  }
  return meta
}

export const deadLegs: Check = (ctx) => {
  const pump = ctx.pump
  if (!pump) return []
  const { topo, classes } = ctx.open
  const { isBridge, classOf } = classes
  const suction = topo.nodeIndex.get(centreNode(pump))!
  const pumpEdge = topo.edges.findIndex((e) => e.kind === 'pump' && e.comp === pump)
  if (pumpEdge < 0 || isBridge[pumpEdge]) return [] // nothing circulates at all: no-circulation says so
  const meta = nodeMeta(ctx, topo)
  const nClasses = Math.max(...classOf) + 1
  const members: number[][] = Array.from({ length: nClasses }, () => [])
  classOf.forEach((c, v) => members[c]!.push(v))

  // A node justifies the branch it ends: a terminal part, or a vent/fill/drain port reached by a hose.
  const purpose = new Array<boolean>(nClasses).fill(false)
  topo.nodeNames.forEach((_, v) => {
    const m = meta[v]!
    const ok = (m.comp && TERMINAL_TYPES.has(m.comp.comp.type)) || (m.port && m.port.joined && TERMINAL_ROLES.has(m.port.port.role))
    if (ok) purpose[classOf[v]!] = true
  })
  const bridgesOf: number[][] = Array.from({ length: nClasses }, () => [])
  const innerHoses = new Array<number>(nClasses).fill(0)
  topo.edges.forEach((e, i) => {
    if (isBridge[i]) { bridgesOf[classOf[e.v]!]!.push(i); bridgesOf[classOf[e.w]!]!.push(i) }
    else if (e.kind === 'hose') innerHoses[classOf[e.v]!]!++
  })

  // The bridges form a forest over the classes; root it at the pump's class.
  const root = classOf[suction]!
  const parentEdge = new Array<number>(nClasses).fill(-2)
  const order: number[] = [root]
  parentEdge[root] = -1
  for (let i = 0; i < order.length; i++) {
    const c = order[i]!
    for (const ei of bridgesOf[c]!) {
      const e = topo.edges[ei]!
      const other = classOf[e.v] === c ? classOf[e.w]! : classOf[e.v]!
      if (parentEdge[other] === -2) { parentEdge[other] = ei; order.push(other) }
    }
  }
  const justified = [...purpose]
  const hoseCount = [...innerHoses]
  const parentOf = (c: number) => {
    const e = topo.edges[parentEdge[c]!]!
    return classOf[e.v] === c ? classOf[e.w]! : classOf[e.v]!
  }
  for (let i = order.length - 1; i > 0; i--) {
    const c = order[i]!
    const p = parentOf(c)
    if (justified[c]) justified[p] = true
    hoseCount[p]! += hoseCount[c]! + (topo.edges[parentEdge[c]!]!.kind === 'hose' ? 1 : 0)
  }

  const out: Finding[] = []
  for (let i = 1; i < order.length; i++) {
    const c = order[i]!
    const p = parentOf(c)
    const viaHose = topo.edges[parentEdge[c]!]!.kind === 'hose' ? 1 : 0
    if (justified[c] || hoseCount[c]! + viaHose === 0) continue
    if (p !== root && !justified[p]) continue // inside a dead branch already reported
    out.push(describeDeadBranch(ctx, topo, meta, classOf, order, parentEdge, c))
  }
  return out
}

function describeDeadBranch(
  ctx: AnalysisContext, topo: TopoGraph, meta: NodeMeta[], classOf: number[],
  order: number[], parentEdge: number[], top: number,
): Finding {
  // Collect the subtree: classes below `top` in BFS order.
  const inSub = new Set<number>([top])
  for (const c of order) {
    if (c === top || parentEdge[c]! < 0) continue
    const e = topo.edges[parentEdge[c]!]!
    const parent = classOf[e.v] === c ? classOf[e.w]! : classOf[e.v]!
    if (inSub.has(parent)) inSub.add(c)
  }
  const hoses: HoseInfo[] = []
  const comps: CompInfo[] = []
  const ports: PortInfo[] = []
  const deadEnds: string[] = []
  const entry = topo.edges[parentEdge[top]!]!
  if (entry.hose) hoses.push(entry.hose)
  topo.edges.forEach((e, i) => {
    if (e.kind === 'hose' && e.hose && inSub.has(classOf[e.v]!) && inSub.has(classOf[e.w]!) && (i !== parentEdge[top])) hoses.push(e.hose)
  })
  topo.nodeNames.forEach((_, v) => {
    if (!inSub.has(classOf[v]!)) return
    const m = meta[v]!
    if (m.comp) comps.push(m.comp)
    if (m.port) ports.push(m.port)
    if (topo.adjacency[v]!.length === 1) {
      if (m.port) deadEnds.push(`${portName(m.port)} (${m.port.port.blocked ? 'plugged' : m.port.joined ? 'joined' : 'open'})`)
      else if (m.comp) deadEnds.push(m.comp.comp.label)
      else if (m.hoseEnd) deadEnds.push(`the free end of ${hoseName(m.hoseEnd)}`)
    }
  })
  hoses.sort((a, b) => a.rank - b.rank)
  comps.sort((a, b) => a.rank - b.rank)
  const start = entry.port ?? (entry.hose && (classOf[topo.edges[parentEdge[top]!]!.v] === top ? entry.hose.to.port : entry.hose.from.port)) ?? null
  const startText = start ? `from ${portName(start)}` : ''
  const heater = comps.find((c) => c.comp.type === 'heater-core')
  const what = heater
    ? `The heater loop through ${heater.comp.label} is joined at one end only`
    : `The branch ${startText}`.trim() + ' leads nowhere'
  const through = [...hoses.map((h) => h.tag), ...comps.map((c) => c.comp.label)].join(', ')
  return makeFinding(
    ctx, 'dead-leg', 'warning',
    `${what} (${through}); it ends at ${deadEnds.join(', ') || 'a closed end'}. No coolant can flow through it, so it stays cold, traps air and collects sludge.`,
    [...hoses.map((h) => h.hose.id), ...comps.map((c) => c.comp.id), ...ports.filter((p) => p.port.blocked || !p.joined).map((p) => p.port.id)],
    heater
      ? `Join the other end of ${heater.comp.label} back to the pump inlet side so coolant flows through it.`
      : 'Join the far end back into the circuit (towards the pump inlet) so coolant flows through, or remove the branch and blank the port it starts from.',
  )
}
