// The fuel figures of a fuel circuit: the engine's demand, where the pump works, the injectors' duty
// and the flow in every line (series model, flow.ts). The fuel checks read these, so a finding and the
// report always agree.
import type { AnalysisContext } from '../context'
import type { CompInfo } from '../model'
import {
  bsfcToLbPerHpH, fuelProperties, injectorFlowAt, kwToHp, litresPerHourToCcPerMin,
} from '../physics'
import { climbKpa, hoseDrop, operatingPoint, type FuelFluid } from './flow'
import type { FuelLayout, PumpLayout } from './layout'
import type { FuelLineFlow, FuelPartLine, FuelPlace, FuelQuantities, InjectorSet } from './types'

export const SERIES_MODEL_TEXT =
  'Series model: every hose from the pump to the regulator carries the pump\'s whole flow (at idle the engine burns next to nothing, so the return carries nearly all of it); ' +
  'past a regulator\'s feed-on port only the engine\'s burn flows. Each hose loses its wall friction (Darcy–Weisbach, Colebrook) and bends (Crane TP-410); ' +
  'the pump works where its curve meets the rail pressure, that drop and the climb to the regulator.'

function pumpCurve(c: CompInfo) {
  return c.comp.type === 'in-tank-pump' || c.comp.type === 'inline-pump' ? c.comp.params.curve : []
}

export function fuelQuantities(ctx: AnalysisContext, layout: FuelLayout): FuelQuantities {
  const s = ctx.doc.circuit.settings.fuel
  const props = fuelProperties(s?.fuel ?? 'petrol', s?.densityKgL)
  const fluid: FuelFluid = { densityKgM3: props.densityKgL * 1000, viscosityPaS: props.viscosityPaS }
  const t = ctx.thresholds
  const demand = s ? {
    powerKw: s.targetPowerKw,
    powerHp: kwToHp(s.targetPowerKw),
    bsfcGPerKwh: s.bsfcGPerKwh,
    bsfcLbPerHpH: bsfcToLbPerHpH(s.bsfcGPerKwh),
    massKgH: (s.targetPowerKw * s.bsfcGPerKwh) / 1000,
    volumeLph: (s.targetPowerKw * s.bsfcGPerKwh) / 1000 / props.densityKgL,
    maxDutyPercent: s.maxInjectorDutyPercent,
    maxBoostKpa: s.maxBoostKpa,
  } : null
  const boost = s?.maxBoostKpa ?? 0

  const r = layout.mainRegulator?.reg
  const regulator = r && r.comp.type === 'fuel-regulator' ? (() => {
    const base = r.comp.params.basePressureKpa
    const referenced = r.comp.params.reference === 'manifold'
    return {
      componentId: r.comp.id, label: r.comp.label, basePressureKpa: base, reference: r.comp.params.reference, style: r.comp.params.style,
      railIdleKpa: base, railFullKpa: referenced ? base + boost : base, injectorDeltaPFullKpa: referenced ? base : base - boost,
    }
  })() : null

  const main = layout.main
  const pointsOf = (p: PumpLayout) => {
    const holder = p.regulators[0]?.reg ?? null
    const rail = (full: boolean) => (holder === r && regulator ? (full ? regulator.railFullKpa : regulator.railIdleKpa) : holder ? basePressure(holder) : 0)
    const climb = climbKpa(p.pump, holder, fluid.densityKgM3)
    return { idle: operatingPoint(pumpCurve(p.pump), p.supply, rail(false), climb, fluid), full: operatingPoint(pumpCurve(p.pump), p.supply, rail(true), climb, fluid) }
  }
  const points = new Map(layout.pumps.map((p) => [p, pointsOf(p)]))
  const margin = t.fuelPumpMarginPercent
  const pump = main ? {
    componentId: main.pump.comp.id, label: main.pump.comp.label, type: main.pump.comp.type as 'in-tank-pump' | 'inline-pump',
    idle: points.get(main)!.idle, full: points.get(main)!.full,
    requiredLph: demand ? demand.volumeLph * (1 + margin / 100) : null, marginPercent: margin,
  } : null

  const sets: InjectorSet[] = layout.injectors.flatMap((c) => {
    if (c.comp.type !== 'injector') return []
    const p = c.comp.params
    const dp = regulator ? regulator.injectorDeltaPFullKpa : p.ratedPressureKpa
    return [{ componentId: c.comp.id, label: c.comp.label, count: p.count, ratedFlowCcMin: p.ratedFlowCcMin, ratedPressureKpa: p.ratedPressureKpa, flowAtFullCcMin: injectorFlowAt(p.ratedFlowCcMin, p.ratedPressureKpa, dp) }]
  })
  const count = sets.reduce((n, x) => n + x.count, 0)
  const demandCcMin = demand ? litresPerHourToCcPerMin(demand.volumeLph) : null
  const capacity = sets.reduce((n, x) => n + x.count * x.flowAtFullCcMin, 0)
  const first = sets[0]
  const injectors = sets.length === 0 ? null : {
    sets, count,
    demandPerInjectorCcMin: demandCcMin !== null ? demandCcMin / count : null,
    dutyPercent: demandCcMin !== null && regulator ? (capacity > 0 ? (100 * demandCcMin) / capacity : Number.POSITIVE_INFINITY) : null,
    neededRatedCcMin: demandCcMin !== null && regulator && first && demand && regulator.injectorDeltaPFullKpa > 0
      ? demandCcMin / count / (demand.maxDutyPercent / 100) / Math.sqrt(regulator.injectorDeltaPFullKpa / first.ratedPressureKpa)
      : null,
  }

  const burnLph = demand?.volumeLph ?? 0
  const returnLph = pump && regulator?.style === 'return' ? { idle: pump.idle.pumpFlowLph, full: Math.max(0, pump.full.pumpFlowLph - burnLph) } : null
  const lines: FuelLineFlow[] = []
  const limit = { suction: t.fuelSuctionVelocityMS, supply: t.fuelSupplyVelocityMS, regulated: t.fuelSupplyVelocityMS, return: t.fuelReturnVelocityMS }
  const flowOf = new Map<string, { flow: number; at: 'idle' | 'full power' }>()
  for (const p of layout.pumps) {
    const idle = points.get(p)!.idle.pumpFlowLph
    for (const h of p.supply.hoses) flowOf.set(h.hose.id, { flow: idle, at: 'idle' })
    for (const h of p.suction?.hoses ?? []) flowOf.set(h.hose.id, { flow: idle, at: 'idle' })
  }
  for (const reg of layout.regulators) {
    const idle = reg.fedBy.reduce((q, p) => q + points.get(p)!.idle.pumpFlowLph, 0)
    for (const h of reg.ret.hoses) if (!flowOf.has(h.hose.id)) flowOf.set(h.hose.id, { flow: idle, at: 'idle' })
    for (const h of reg.feed.hoses) if (!flowOf.has(h.hose.id)) flowOf.set(h.hose.id, { flow: burnLph, at: 'full power' })
  }
  for (const h of ctx.model.hoses) {
    const side = layout.sideOf.get(h)
    const f = flowOf.get(h.hose.id)
    if (!side || !f) continue
    const d = hoseDrop(h, f.flow, fluid)
    lines.push({ hoseId: h.hose.id, tag: h.tag, side, at: f.at, flowLph: f.flow, velocityMS: d.velocityMS, reynolds: d.reynolds, dropKpa: d.dropKpa, limitMS: limit[side] })
  }
  return {
    fuel: { kind: s?.fuel ?? 'petrol', name: props.name, densityKgL: props.densityKgL, ethanolPercent: props.ethanolPercent, viscosityPaS: props.viscosityPaS, source: props.source },
    demand, regulator, pump, injectors, returnLph, lines, parts: partLines(ctx, layout), model: SERIES_MODEL_TEXT,
  }
}

const ROLE_OF: Partial<Record<string, FuelPartLine['role']>> = {
  'fuel-tank': 'tank', 'in-tank-pump': 'pump', 'inline-pump': 'pump', 'fuel-filter': 'filter',
  'fuel-regulator': 'regulator', 'fuel-rail': 'rail', injector: 'injectors',
}

function partLines(ctx: AnalysisContext, layout: FuelLayout): FuelPartLine[] {
  const place = new Map<CompInfo, FuelPlace>()
  const mark = (cs: readonly CompInfo[], p: FuelPlace) => { for (const c of cs) if (!place.has(c)) place.set(c, p) }
  for (const p of layout.pumps) mark(p.suction?.through ?? [], 'before the pump')
  for (const p of layout.pumps) mark(p.supply.through, 'after the pump')
  for (const r of layout.regulators) mark(r.feed.through, 'after the pump')
  for (const r of layout.regulators) mark(r.ret.through, 'on the return')
  return ctx.model.components.flatMap((c) => {
    const role = ROLE_OF[c.comp.type]
    return role ? [{ componentId: c.comp.id, label: c.comp.label, role, place: place.get(c) ?? 'elsewhere' }] : []
  })
}

function basePressure(c: CompInfo): number {
  return c.comp.type === 'fuel-regulator' ? c.comp.params.basePressureKpa : 0
}
