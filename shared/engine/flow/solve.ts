// Solving the network for the thermostat open and shut, and reading the result back onto the circuit:
// per hose its own loss, per part the losses of the paths coolant takes through it, per branch the
// share of the pump's flow.
import type { AnalysisContext } from '../context'
import type { ValveState } from '../graph'
import { coolantProperties, QUADRATIC_LAW_LINEAR_BELOW_M3S, solveNetwork, type NetworkResult } from '../physics'
import { branchesOf } from './branches'
import { buildNetwork, flowSkipReason, operatingTemperatureC, type BuiltNetwork } from './network'
import type { FlowReport, HoseFlow, PartFlow } from './types'

export interface SolvedState {
  report: FlowReport
  built: BuiltNetwork | null
  result: NetworkResult | null
}

export function solveState(ctx: AnalysisContext, state: ValveState): SolvedState {
  const reason = flowSkipReason(ctx)
  if (reason) return { report: { solved: false, state, reason }, built: null, result: null }
  const temperatureC = operatingTemperatureC(ctx)
  const fluid = coolantProperties(ctx.doc.circuit.settings.coolant!.mix, temperatureC)
  const built = buildNetwork(ctx, state, fluid)
  const result = solveNetwork(built.network)
  const losses = splitLosses(built, result)
  const hoses: HoseFlow[] = ctx.model.hoses.map((h) => {
    const i = built.linkOfHose[h.rank]!
    if (i < 0) {
      return { hoseId: h.hose.id, tag: h.tag, flowLpm: 0, velocityMS: 0, reynolds: 0, headLossKpa: 0, partLossAtFromKpa: 0, partLossAtToKpa: 0, carriesFlow: false }
    }
    const r = result.links[i]!
    // the split is signed like the link; the report gives losses in the direction of flow
    const sign = r.flowLpm < 0 ? -1 : 1
    return {
      hoseId: h.hose.id, tag: h.tag, flowLpm: r.flowLpm, velocityMS: r.velocityMS ?? 0, reynolds: r.reynolds ?? 0,
      headLossKpa: sign * losses.own[i]!, partLossAtFromKpa: sign * losses.atFrom[i]!, partLossAtToKpa: sign * losses.atTo[i]!, carriesFlow: true,
    }
  })
  const pumpLink = built.pumpLink >= 0 ? result.links[built.pumpLink]! : null
  const pumpFlowLpm = pumpLink ? Math.abs(pumpLink.flowLpm) : 0
  const notes = [...(fluid.notes ?? [])]
  if (result.message) notes.push(result.message)
  return {
    built,
    result,
    report: {
      solved: true,
      state,
      temperatureC,
      fluid: { densityKgM3: fluid.densityKgM3, viscosityPaS: fluid.viscosityPaS, source: fluid.source },
      converged: result.converged,
      iterations: result.iterations,
      pumpFlowLpm,
      pumpRiseKpa: pumpLink ? -(pumpLink.headLossKpa ?? 0) : 0,
      referenceText: built.referenceText,
      hoses,
      parts: partFlows(ctx, built, result, losses),
      branches: branchesOf(ctx, built, result, pumpFlowLpm),
      defaultedComponentIds: built.defaulted,
      notes,
    },
  }
}

interface LossSplit {
  /** per link, kPa, signed like the link's head loss: the hose's own friction and bends */
  own: Float64Array
  /** per link, kPa, signed the same way: the part paths at its from end and at its to end */
  atFrom: Float64Array
  atTo: Float64Array
}

/**
 * Each pipe's head loss is its own friction and bends plus K·ρv²/2 of the part paths at its ends
 * (network.ts). The part losses are worked out with the solver's law for K (continued linearly below
 * QUADRATIC_LAW_LINEAR_BELOW_M3S) and the hose keeps the rest, so the pieces add up to the pipe's
 * loss exactly.
 */
function splitLosses(built: BuiltNetwork, result: NetworkResult): LossSplit {
  const n = built.network.links.length
  const own = new Float64Array(n)
  const atFrom = new Float64Array(n)
  const atTo = new Float64Array(n)
  const rho = built.network.fluid.densityKgM3
  const linearBelow = QUADRATIC_LAW_LINEAR_BELOW_M3S
  for (let i = 0; i < n; i++) {
    const link = built.network.links[i]!
    if (link.kind !== 'pipe') continue
    const q = result.links[i]!.flowLpm / 60000
    const area = (Math.PI / 4) * link.diameterM * link.diameterM
    const aq = Math.max(Math.abs(q), linearBelow)
    const perK = (rho * q * aq) / (2 * area * area * 1000)
    atFrom[i] = built.fromEndK[i]! * perK
    atTo[i] = built.toEndK[i]! * perK
    own[i] = (result.links[i]!.headLossKpa ?? 0) - atFrom[i]! - atTo[i]!
  }
  return { own, atFrom, atTo }
}

function partFlows(ctx: AnalysisContext, built: BuiltNetwork, result: NetworkResult, losses: LossSplit): PartFlow[] {
  const out: PartFlow[] = []
  for (const c of ctx.model.components) {
    if (built.networkNodeOf[ctx.graph.partNode[c.rank]!]! < 0) continue
    let inflow = 0
    let inLoss = 0
    let outLoss = 0
    let passes = false
    for (const p of c.ports) {
      const hose = p.joined
      if (!hose) continue
      const i = built.linkOfHose[hose.rank]!
      if (i < 0) continue
      passes = true
      const q = result.links[i]!.flowLpm
      // flow into the part at this port, and the loss of its path in the direction of flow
      const atTo = p.joinedEnd === 'to'
      const into = atTo ? q : -q
      const loss = Math.abs(atTo ? losses.atTo[i]! : losses.atFrom[i]!)
      if (into > 0) {
        inflow += into
        if (loss > inLoss) inLoss = loss
      } else if (into < 0 && loss > outLoss) outLoss = loss
    }
    if (passes) out.push({ componentId: c.comp.id, label: c.comp.label, flowLpm: inflow, dropKpa: inLoss + outLoss })
  }
  return out
}
