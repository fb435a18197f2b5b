// Dead legs: a hose on a bridge of the circuit graph can carry no steady flow (what enters a branch
// that leads nowhere must also leave by the same way), so a branch hanging off the loop is dead unless
// it was built to end there: a bleed, drain, vent, fill or overflow line, or a tank.
import { makeFinding, type AnalysisContext, type Check } from '../context'
import type { GraphEdge } from '../graph'
import { buildLoopTree, loopName } from './loopTree'
import { hoseName, portName, type CompInfo, type HoseInfo, type PortInfo } from '../model'
import type { Finding } from '../report'

/** Parts a branch may lead to and stop: their whole purpose is a dead end. */
export const TERMINAL_TYPES = new Set(['bleed-valve', 'drain', 'overflow-bottle', 'expansion-tank', 'deaeration-pot', 'pressure-cap'])
const TERMINAL_ROLES = new Set(['vent', 'fill', 'drain'])

const endsAtPurpose = (p: PortInfo | null) => p !== null && TERMINAL_ROLES.has(p.port.role)

/**
 * The bridges form a tree over the loop classes, rooted at the pump's class. For each class below the
 * root, with its entry hose from the parent (ends `a` on the parent's side, `c` on its own):
 * - the subtree is justified when it holds a terminal part, or a hose inside it ends at a vent, fill
 *   or drain port; a vent, fill or drain port justifies the branch on the pump's side of it only;
 * - `c` being such a port justifies the entry hose (the line is built to end there) but not what lies
 *   beyond the part it is on;
 * - the biggest unjustified branch is reported once: the entry hose and its subtree when neither `c`
 *   nor the subtree is justified, else the subtree alone when it holds hoses.
 */
export const deadLegs: Check = (ctx) => {
  const pump = ctx.pump
  if (!pump) return []
  const g = ctx.open
  const { edges } = ctx.graph
  const { isBridge, classOf } = g
  if (isBridge[ctx.graph.pumpEdge]) return [] // nothing circulates at all: no-circulation says so
  const nClasses = g.classCount
  const root = classOf[ctx.graph.partNode[pump.rank]!]!
  const tree = buildLoopTree(ctx, root)

  // per class: a terminal part or a purposeful port in it; its non-bridge hoses
  const purpose = new Uint8Array(nClasses)
  const innerHoses = new Int32Array(nClasses)
  for (const node of ctx.graph.nodes) if (node.comp && TERMINAL_TYPES.has(node.comp.comp.type)) purpose[classOf[node.index]!] = 1
  for (const e of edges) {
    if (e.kind !== 'hose' || isBridge[e.index]) continue
    innerHoses[classOf[e.v]!]!++
    if (endsAtPurpose(e.hose!.from.port) || endsAtPurpose(e.hose!.to.port)) purpose[classOf[e.v]!] = 1
  }
  // the tree, breadth first from the pump's loop, through graphlib
  const parentEdge = new Int32Array(nClasses).fill(-2)
  const parentClass = new Int32Array(nClasses).fill(-1)
  parentEdge[root] = -1
  const order: number[] = [root]
  for (let i = 0; i < order.length; i++) {
    const c = order[i]!
    const name = loopName(c)
    for (const te of tree.nodeEdges(name) ?? []) {
      const other = tree.node(te.v === name ? te.w : te.v)!.loop
      if (parentEdge[other] !== -2) continue
      parentEdge[other] = tree.edge(te)!.index
      parentClass[other] = c
      order.push(other)
    }
  }
  const parentOf = (c: number) => parentClass[c]!
  const sideOf = (e: GraphEdge, c: number) => (classOf[e.v] === c ? e.hose!.from.port : e.hose!.to.port)
  // leaves first: subtree hose counts and justification; a purposeful port on the parent's side of an
  // entry hose justifies the parent
  const justified = purpose.slice()
  const hoseCount = innerHoses.slice()
  const entryJustified = new Uint8Array(nClasses)
  for (let i = order.length - 1; i > 0; i--) {
    const c = order[i]!
    const e = edges[parentEdge[c]!]!
    const p = parentOf(c)
    entryJustified[c] = endsAtPurpose(sideOf(e, c)) || justified[c] ? 1 : 0
    if (entryJustified[c] || endsAtPurpose(sideOf(e, p))) justified[p] = 1
    hoseCount[p]! += hoseCount[c]! + 1
  }
  const out: Finding[] = []
  for (let i = 1; i < order.length; i++) {
    const c = order[i]!
    if (justified[c]) continue
    const p = parentOf(c)
    if (!entryJustified[c]) {
      if (p !== root && !justified[p]) continue // inside a dead branch already reported
      out.push(describeDeadBranch(ctx, order, parentEdge, parentOf, c, true))
    } else if (hoseCount[c]! > 0) {
      out.push(describeDeadBranch(ctx, order, parentEdge, parentOf, c, false))
    }
  }
  return out
}

function describeDeadBranch(
  ctx: AnalysisContext, order: number[], parentEdge: Int32Array, parentOf: (c: number) => number,
  top: number, withEntry: boolean,
): Finding {
  const { nodes, edges } = ctx.graph
  const { classOf } = ctx.open
  // the subtree: classes below `top`, in breadth-first order
  const inSub = new Set<number>([top])
  for (const c of order) if (c !== top && parentEdge[c]! >= 0 && inSub.has(parentOf(c))) inSub.add(c)
  const entry = edges[parentEdge[top]!]!
  const hoses: HoseInfo[] = withEntry ? [entry.hose!] : []
  for (const e of edges) {
    if (e.kind === 'hose' && e !== entry && inSub.has(classOf[e.v]!) && inSub.has(classOf[e.w]!)) hoses.push(e.hose!)
  }
  const comps: CompInfo[] = []
  const ports: PortInfo[] = []
  const deadEnds: string[] = []
  for (const c of ctx.model.components) {
    if (!inSub.has(classOf[ctx.graph.partNode[c.rank]!]!)) continue
    comps.push(c)
    if (c.ports.length === 1) deadEnds.push(c.comp.label)
    for (const p of c.ports) {
      ports.push(p)
      if (!p.joined) deadEnds.push(`${portName(p)} (${p.port.blocked ? 'plugged' : 'open'})`)
    }
  }
  for (const node of nodes) {
    if (node.freeEnd && inSub.has(classOf[node.index]!)) deadEnds.push(`the free end of ${hoseName(node.freeEnd.hose)}`)
  }
  hoses.sort((a, b) => a.rank - b.rank)
  // where the branch leaves the loop: the entry hose's port on the loop side, or (when the entry is
  // justified) the port on this side that the entry hose reaches
  const entrySide = classOf[entry.v] === top ? entry.hose!.to.port : entry.hose!.from.port
  const ownSide = classOf[entry.v] === top ? entry.hose!.from.port : entry.hose!.to.port
  const start = withEntry ? entrySide : ownSide
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
