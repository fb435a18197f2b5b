// Solving the network for the thermostat open and shut, and reading the result back onto the circuit.
import type { AnalysisContext } from '../context'
import type { ValveState } from '../graph'
import type { CompInfo, HoseInfo } from '../model'
import { coolantProperties, solveNetwork, type LinkResult } from '../physics'
import { buildNetwork, flowSkipReason, operatingTemperatureC, type BuiltNetwork } from './network'
import type { BranchFlow, BranchKind, FlowReport, HoseFlow } from './types'

export interface SolvedState {
  report: FlowReport
  built: BuiltNetwork | null
  byLink: Map<string, LinkResult>
}

export function solveState(ctx: AnalysisContext, state: ValveState): SolvedState {
  const reason = flowSkipReason(ctx)
  if (reason) return { report: { solved: false, state, reason }, built: null, byLink: new Map() }
  const temperatureC = operatingTemperatureC(ctx)
  const fluid = coolantProperties(ctx.doc.circuit.settings.coolant!.mix, temperatureC)
  const built = buildNetwork(ctx, state, fluid)
  const result = solveNetwork(built.network)
  const byLink = new Map(result.links.map((l) => [l.id, l]))
  const hoses: HoseFlow[] = ctx.model.hoses.map((h) => {
    const r = byLink.get(`h:${h.hose.id}`)
    return r
      ? { hoseId: h.hose.id, tag: h.tag, flowLpm: r.flowLpm, velocityMS: r.velocityMS ?? 0, reynolds: r.reynolds ?? 0, dropKpa: r.dropKpa, carriesFlow: true }
      : { hoseId: h.hose.id, tag: h.tag, flowLpm: 0, velocityMS: 0, reynolds: 0, dropKpa: 0, carriesFlow: false }
  })
  const pumpLink = byLink.get(`pump:${ctx.pump!.comp.id}`)
  const pumpFlowLpm = pumpLink ? Math.abs(pumpLink.flowLpm) : 0
  const notes = [...(fluid.notes ?? [])]
  if (result.message) notes.push(result.message)
  return {
    built,
    byLink,
    report: {
      solved: true,
      state,
      temperatureC,
      fluid: { densityKgM3: fluid.densityKgM3, viscosityPaS: fluid.viscosityPaS, source: fluid.source },
      converged: result.converged,
      iterations: result.iterations,
      pumpFlowLpm,
      pumpRiseKpa: pumpLink ? -pumpLink.dropKpa : 0,
      referenceText: built.referenceText,
      hoses,
      branches: branchesOf(ctx, built, byLink, pumpFlowLpm),
      defaultedComponentIds: built.defaulted,
      notes,
    },
  }
}

/**
 * Branches: runs of network links between junctions (nodes where three or more links meet). Flow is
 * the same all along a branch, so one figure describes it.
 */
function branchesOf(ctx: AnalysisContext, built: BuiltNetwork, byLink: Map<string, LinkResult>, pumpFlow: number): BranchFlow[] {
  const { links, nodes } = built.network
  const index = new Map(nodes.map((n, i) => [n.id, i]))
  const ends = links.map((l) => [index.get(l.from)!, index.get(l.to)!] as const)
  const incident: number[][] = nodes.map(() => [])
  ends.forEach(([a, b], i) => { incident[a]!.push(i); incident[b]!.push(i) })
  const used = new Array<boolean>(links.length).fill(false)
  const branches: BranchFlow[] = []
  for (let start = 0; start < links.length; start++) {
    if (used[start]) continue
    used[start] = true
    const members = [start]
    const interior: number[] = []
    for (const side of [0, 1] as const) {
      let e = start
      let v = ends[start]![side]
      while (incident[v]!.length === 2) {
        const next = incident[v]![0] === e ? incident[v]![1]! : incident[v]![0]!
        if (used[next]) break
        interior.push(v)
        used[next] = true
        members.push(next)
        v = ends[next]![0] === v ? ends[next]![1] : ends[next]![0]
        e = next
      }
    }
    const hoses: HoseInfo[] = []
    const comps = new Set<CompInfo>()
    let flow = 0
    let touchesBypass = false
    for (const li of members) {
      const link = links[li]!
      const r = byLink.get(link.id)
      if (r) flow = Math.max(flow, Math.abs(r.flowLpm))
      if (link.kind === 'pump') { comps.add(ctx.pump!); continue }
      const h = ctx.model.hoseById.get(link.id.slice(2))!
      hoses.push(h)
      for (const end of [h.from, h.to]) {
        const t = end.port!.comp.comp
        if (t.type === 'thermostat' && end.port!.port.id !== t.params.valvedPortId && end.port!.port.role === 'outlet') touchesBypass = true
      }
    }
    for (const v of interior) comps.add(built.partAt.get(nodes[v]!.id)!)
    const compList = [...comps].sort((a, b) => a.rank - b.rank)
    hoses.sort((a, b) => a.rank - b.rank)
    const has = (t: string) => compList.some((c) => c.comp.type === t)
    const kind: BranchKind = has('radiator') ? 'radiator' : has('heater-core') ? 'heater' : has('water-pump') ? 'pump'
      : touchesBypass ? 'bypass' : has('expansion-tank') || has('deaeration-pot') || has('pressure-cap') ? 'vent' : 'other'
    const label = compList.length > 0 ? compList.map((c) => c.comp.label).join(', ') : hoses.map((h) => h.tag).join(', ')
    branches.push({
      kind, label,
      componentIds: compList.map((c) => c.comp.id),
      hoseIds: hoses.map((h) => h.hose.id),
      tags: hoses.map((h) => h.tag),
      flowLpm: flow,
      shareOfPump: pumpFlow > 0 ? flow / pumpFlow : 0,
    })
  }
  const rank = new Map(branches.map((b) => [b, firstRank(ctx, b)]))
  return branches.sort((a, b) => rank.get(a)! - rank.get(b)!)
}

function firstRank(ctx: AnalysisContext, b: BranchFlow): number {
  let best = Infinity
  for (const id of b.hoseIds.length > 0 ? b.hoseIds : b.componentIds) best = Math.min(best, ctx.model.rankOf(id))
  return best
}
