// Checks on the solved flow: velocity, starved branches, ports run against their stated direction.
import { makeFinding, type AnalysisContext } from '../context'
import type { SolvedState } from '../flow/solve'
import { fmt, hoseName, portName } from '../model'
import type { Finding } from '../report'

/** Below this a computed flow is solver noise, not a direction. */
const DIRECTION_NOISE_LPM = 0.1

export function flowFindings(ctx: AnalysisContext, open: SolvedState, closed: SolvedState): Finding[] {
  const out: Finding[] = []
  const states = [open, closed].filter((s) => s.report.solved)
  // high-velocity: the worst of the two states, one finding per hose (the reports list the hoses in
  // the model's order)
  const hoses = ctx.model.hoses
  for (let i = 0; i < hoses.length; i++) {
    const h = hoses[i]!
    let worst: { v: number; state: string; q: number } | null = null
    for (const s of states) {
      if (!s.report.solved) continue
      const hf = s.report.hoses[i]!
      const v = Math.abs(hf.velocityMS)
      if (v > ctx.thresholds.maxVelocityMS && (!worst || v > worst.v)) worst = { v, state: s.report.state, q: Math.abs(hf.flowLpm) }
    }
    if (!worst) continue
    const w = worst
    out.push(makeFinding(ctx, 'high-velocity', 'warning',
      `Coolant runs at ${fmt(w.v, 2)} m/s in ${hoseName(h)} (${fmt(w.q, 1)} L/min through ${fmt(h.hose.insideDiameterMm, 1)} mm bore, thermostat ${w.state}), above ${fmt(ctx.thresholds.maxVelocityMS, 1)} m/s: expect erosion and noise.`,
      [h.hose.id],
      `Use a larger bore for ${h.tag}: at ${fmt(w.q, 1)} L/min a ${fmt(Math.ceil(Math.sqrt((4 * w.q) / 60000 / Math.PI / ctx.thresholds.maxVelocityMS) * 1000), 0)} mm bore keeps under ${fmt(ctx.thresholds.maxVelocityMS, 1)} m/s.`))
  }
  // low-flow: heat-exchanger branches with the thermostat open
  if (open.report.solved) {
    for (const b of open.report.branches) {
      if ((b.kind !== 'radiator' && b.kind !== 'heater') || b.flowLpm >= ctx.thresholds.minBranchFlowLpm) continue
      out.push(makeFinding(ctx, 'low-flow', 'warning',
        `Only ${fmt(b.flowLpm, 2)} L/min goes through the ${b.kind} branch (${b.label}${b.tags.length ? `; ${b.tags.join(', ')}` : ''}) with the thermostat open, under the ${fmt(ctx.thresholds.minBranchFlowLpm, 1)} L/min it needs: it is starved.`,
        [...b.componentIds, ...b.hoseIds],
        b.kind === 'heater'
          ? 'Take the heater feed from a point of higher pressure (pump outlet side) and return it to the pump inlet, or use larger heater hoses.'
          : 'Check the radiator hoses and thermostat for a restriction; the radiator must take most of the pump flow when the thermostat is open.'))
    }
  }
  // direction-conflict against the computed flow
  const reported = new Set<string>()
  for (const s of states) {
    if (!s.report.solved) continue
    const flows = s.report.hoses
    for (let i = 0; i < hoses.length; i++) {
      const hf = flows[i]!
      if (Math.abs(hf.flowLpm) < DIRECTION_NOISE_LPM) continue
      const h = hoses[i]!
      for (let e = 0; e < 2; e++) {
        const end = e === 0 ? h.from : h.to
        const p = end.port
        if (!p || (p.port.role !== 'inlet' && p.port.role !== 'outlet') || reported.has(p.port.id)) continue
        const leavesPort = end.name === 'from' ? hf.flowLpm > 0 : hf.flowLpm < 0
        const wrong = (p.port.role === 'inlet' && leavesPort) || (p.port.role === 'outlet' && !leavesPort)
        if (!wrong) continue
        reported.add(p.port.id)
        out.push(makeFinding(ctx, 'direction-conflict', 'warning',
          `With the thermostat ${s.report.state}, ${fmt(Math.abs(hf.flowLpm), 1)} L/min flows ${leavesPort ? 'out of' : 'into'} ${portName(p)}, which is marked as an ${p.port.role}.`,
          [p.port.id, h.hose.id],
          `Check how ${h.tag} and the parts either side are joined: coolant should enter ${p.port.role === 'inlet' ? 'this inlet' : 'the circuit from this outlet'}.`))
      }
    }
  }
  // the solver's own trouble is worth a note
  for (const s of states) {
    if (s.report.solved && !s.report.converged) {
      out.push(makeFinding(ctx, 'flow-not-converged', 'note',
        `The flow solve with the thermostat ${s.report.state} did not settle after ${s.report.iterations} steps; its figures are approximate.`,
        [], 'Check for very small bores or extreme resistances on parts.'))
    }
  }
  if (open.report.solved && open.report.defaultedComponentIds.length > 0) {
    const names = open.report.defaultedComponentIds.map((id) => ctx.model.compById.get(id)!.comp.label)
    out.push(makeFinding(ctx, 'flow-default-resistance', 'note',
      `The flow figures use typical resistances for ${names.join(', ')}: no data-sheet figure was entered.`,
      open.report.defaultedComponentIds, 'Enter each part’s pressure drop at a rated flow from its data sheet for figures you can rely on.'))
  }
  return out
}
