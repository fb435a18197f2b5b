// Fuel checks on sizes against the engine's demand: the pump, the injectors, the regulator's reference
// under boost and the velocity in each line. All of them read the figures in quantities.fuel.
import { makeFinding, type AnalysisContext } from '../context'
import { fmt, hoseName } from '../model'
import { ccPerMinToLbPerHour } from '../physics'
import type { Finding } from '../report'
import { NOMINAL_HOSE_BORES_MM } from '../sizes'
import { pressureText } from './layoutChecks'
import type { FuelLayout, FuelSide } from './layout'
import type { FuelQuantities } from './types'

const lph = (v: number) => `${fmt(v, 0)} L/h`

export function regulatorUnreferenced(ctx: AnalysisContext, layout: FuelLayout): Finding[] {
  const boost = ctx.doc.circuit.settings.fuel?.maxBoostKpa ?? 0
  if (boost <= 0) return []
  const out: Finding[] = []
  for (const r of layout.regulators) {
    const reg = r.reg.comp
    if (reg.type !== 'fuel-regulator' || reg.params.reference !== 'none') continue
    const base = reg.params.basePressureKpa
    const left = base - boost
    const share = left > 0 ? Math.sqrt(left / base) : 0
    out.push(makeFinding(ctx, 'regulator-unreferenced', 'warning',
      `${reg.label} is not referenced to the intake manifold, but the engine sees up to ${pressureText(boost)} of boost: at full boost the pressure across the injectors falls from ${pressureText(base)} to ${left > 0 ? pressureText(left) : 'nothing'}, ` +
      `so they flow ${fmt(share * 100, 0)} % of their figure at idle (flow goes with √Δp) and the mixture leans out when the engine makes the most power.`,
      [reg.id],
      reg.params.style === 'returnless'
        ? `Join the reference port of ${reg.label} to the intake manifold after the throttle so it is boost-referenced 1:1, or let the engine management correct for the rail-to-manifold pressure.`
        : `Join the reference port of ${reg.label} to the intake manifold after the throttle, so fuel pressure rises with boost 1:1 (boost-referenced 1:1).`,
      { type: 'set-regulator-reference', componentId: reg.id, reference: 'manifold' }))
  }
  return out
}

export function pumpUndersized(ctx: AnalysisContext, q: FuelQuantities): Finding[] {
  const p = q.pump
  const d = q.demand
  if (!p || !d || !q.regulator || p.requiredLph === null) return []
  const full = p.full
  if (full.pumpFlowLph >= p.requiredLph) return []
  const ids = [p.componentId, q.regulator.componentId]
  return [makeFinding(ctx, 'pump-undersized', 'warning',
    `At ${fmt(d.powerKw, 0)} kW (${fmt(d.powerHp, 0)} hp) the engine burns ${lph(d.volumeLph)} (${fmt(d.bsfcGPerKwh, 0)} g/kWh, ${fmt(d.bsfcLbPerHpH, 2)} lb/(hp·h), at ${fmt(q.fuel.densityKgL, 3)} kg/L); ` +
    `with a ${fmt(p.marginPercent, 0)} % margin the pump must deliver ${lph(p.requiredLph)} against ${pressureText(full.pumpOutletKpa)} ` +
    `(rail ${pressureText(full.railPressureKpa)}, supply line ${fmt(full.supplyDropKpa, 1)} kPa, climb ${fmt(full.climbKpa, 1)} kPa). ${p.label} gives ${lph(full.pumpFlowLph)} there.`,
    ids,
    `Fit a pump that delivers at least ${lph(p.requiredLph)} at ${pressureText(full.pumpOutletKpa)} (from its maker's curve at the system voltage), or lower the target power.`)]
}

export function injectorUndersized(ctx: AnalysisContext, q: FuelQuantities): Finding[] {
  const inj = q.injectors
  const d = q.demand
  const reg = q.regulator
  if (!inj || !d || !reg || inj.dutyPercent === null || inj.demandPerInjectorCcMin === null) return []
  if (inj.dutyPercent <= d.maxDutyPercent) return []
  const first = inj.sets[0]!
  const rho = q.fuel.densityKgL
  const dp = reg.injectorDeltaPFullKpa
  const flowText = inj.sets.map((s) => `${s.count} × ${fmt(s.ratedFlowCcMin, 0)} cc/min at ${pressureText(s.ratedPressureKpa)}, ${fmt(s.flowAtFullCcMin, 0)} cc/min at the ${dp > 0 ? pressureText(dp) : 'no pressure'} across them`).join('; ')
  const dutyText = Number.isFinite(inj.dutyPercent) ? `${fmt(inj.dutyPercent, 0)} %` : 'more than all'
  const need = inj.neededRatedCcMin
  return [makeFinding(ctx, 'injector-undersized', 'warning',
    `At ${fmt(d.powerKw, 0)} kW each of the ${inj.count} injectors must deliver ${fmt(inj.demandPerInjectorCcMin, 0)} cc/min (${fmt(ccPerMinToLbPerHour(inj.demandPerInjectorCcMin, rho), 1)} lb/h); ` +
    `they give ${flowText} (flow × √(Δp ÷ Δp rated)), so they would be open ${dutyText} of the time, above the ${fmt(d.maxDutyPercent, 0)} % limit.`,
    inj.sets.map((s) => s.componentId),
    need !== null
      ? `Use injectors of at least ${fmt(Math.ceil(need), 0)} cc/min (${fmt(ccPerMinToLbPerHour(need, rho), 1)} lb/h) rated at ${pressureText(first.ratedPressureKpa)}, or raise the regulator's base pressure.`
      : 'The pressure across the injectors is gone at full boost: reference the regulator to the manifold, then size the injectors.')]
}

const SIDE_WORDS: Record<FuelSide, string> = {
  suction: 'the suction line to the pump', supply: 'the pressure line', regulated: 'the regulated feed', return: 'the return line',
}

export function lineVelocity(ctx: AnalysisContext, q: FuelQuantities): Finding[] {
  const out: Finding[] = []
  for (const l of q.lines) {
    if (l.velocityMS <= l.limitMS) continue
    const h = ctx.model.hoseById.get(l.hoseId)!
    // the smallest usual bore that keeps the flow under the limit
    const minBore = Math.sqrt((4 * l.flowLph) / 3.6e6 / Math.PI / l.limitMS) * 1000
    const bore = NOMINAL_HOSE_BORES_MM.find((b) => b >= minBore)
    out.push(makeFinding(ctx, 'line-velocity', 'warning',
      `Fuel runs at ${fmt(l.velocityMS, 2)} m/s in ${hoseName(h)}, ${SIDE_WORDS[l.side]} (${lph(l.flowLph)} at ${l.at} through ${fmt(h.hose.insideDiameterMm, 2)} mm bore), above ${fmt(l.limitMS, 1)} m/s` +
      `${l.side === 'return' ? ': the return back-pressures the regulator and the rail pressure creeps up at idle' : l.side === 'suction' ? ': the pump’s inlet starves and the fuel vapours' : ': the line’s own drop eats into the pump’s margin'}.`,
      [h.hose.id],
      bore !== undefined ? `Use ${fmt(bore, 2)} mm bore or larger for ${h.tag} (at least ${fmt(minBore, 1)} mm keeps under ${fmt(l.limitMS, 1)} m/s).` : `Use a bore of at least ${fmt(minBore, 1)} mm for ${h.tag}.`,
      bore !== undefined ? { type: 'set-hose-bore', hoseId: h.hose.id, insideDiameterMm: bore } : undefined))
  }
  return out
}

/** What the demand checks could not run without, said once. */
export function demandIncomplete(ctx: AnalysisContext, layout: FuelLayout, q: FuelQuantities): Finding[] {
  const missing: string[] = []
  if (!q.demand) missing.push('fuel settings (target power, BSFC, injector duty, boost)')
  if (layout.pumps.length === 0) missing.push('a fuel pump')
  else if (!layout.main) missing.push('a pump whose outlet reaches the rail or the regulator')
  if (layout.regulators.length === 0) missing.push('a pressure regulator')
  if (layout.injectors.length === 0) missing.push('the injectors')
  if (missing.length === 0) return []
  return [makeFinding(ctx, 'fuel-demand-incomplete', 'note',
    `The pump, injector and line sizes are not checked until the circuit has ${missing.join(', ')}.`,
    [], 'Add the missing parts and settings; the pump, injector and line checks then run.')]
}
