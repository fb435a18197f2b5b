// The series model of a fuel line: every hose on a pump's supply side carries the pump's whole flow one
// after the other (parallel branches are taken in series, which overstates their drop: on the safe
// side). Each hose loses its wall friction (Darcy–Weisbach with Colebrook, physics layer) and its
// bends (Crane TP-410, as for coolant); a part with its own resistance on the way adds it. The pump
// works where its curve meets rail pressure + that drop + the climb to the regulator.
import type { FuelPumpPoint, Resistance } from '../../circuit'
import { routeBendK, roughnessFor } from '../flow/resistances'
import type { CompInfo, HoseInfo } from '../model'
import { darcyPressureDropPerMetre, STANDARD_GRAVITY } from '../physics'
import type { FuelOperatingPoint } from './types'
import type { Walk } from './walk'

export interface FuelFluid {
  densityKgM3: number
  viscosityPaS: number
}

/**
 * The pump's flow against an outlet pressure: straight lines between the curve's points, carried on
 * past the ends (a pump gives more below its first point and less past its last), never below zero.
 */
export function pumpFlowAt(curve: readonly FuelPumpPoint[], pressureKpa: number): number {
  const pts = [...curve].sort((a, b) => a.pressureKpa - b.pressureKpa)
  if (pts.length === 0) return 0
  if (pts.length === 1) return pts[0]!.flowLph
  let i = 0
  while (i < pts.length - 2 && pressureKpa > pts[i + 1]!.pressureKpa) i++
  const a = pts[i]!
  const b = pts[i + 1]!
  const slope = (b.flowLph - a.flowLph) / (b.pressureKpa - a.pressureKpa)
  return Math.max(0, a.flowLph + slope * (pressureKpa - a.pressureKpa))
}

/** Velocity in a bore, m/s, for a flow in L/h. */
export function velocityMS(flowLph: number, boreMm: number): number {
  const d = boreMm / 1000
  return flowLph / 3.6e6 / ((Math.PI / 4) * d * d)
}

/** A hose's own drop at a flow: friction over its length and its bends, kPa; with velocity and Reynolds number. */
export function hoseDrop(h: HoseInfo, flowLph: number, fluid: FuelFluid): { dropKpa: number; velocityMS: number; reynolds: number } {
  const d = h.hose.insideDiameterMm / 1000
  const line = darcyPressureDropPerMetre(flowLph / 60, d, roughnessFor(h.hose.material), fluid)
  const bends = routeBendK(h.from.point, h.hose.params.route, h.to.point, d)
  const dropPa = line.pressureDropPaPerM * (Math.max(h.lengthMm, 1) / 1000) + bends * line.velocityPressurePa
  return { dropKpa: dropPa / 1000, velocityMS: line.velocityMS, reynolds: line.reynolds }
}

/** A part's own resistance at a flow, kPa; K is taken at the bore it was given for. */
function partDrop(r: Resistance, flowLph: number, densityKgM3: number): number {
  if ('dropKpa' in r) return r.dropKpa * ((flowLph / 60) / r.atFlowLpm) ** 2
  const v = velocityMS(flowLph, r.diameterMm)
  return (r.k * densityKgM3 * v * v) / 2 / 1000
}

/** Everything between the pump and the rail at a flow: the hoses' drops and the resistances of the parts passed. */
export function supplyDropKpa(supply: Walk, flowLph: number, fluid: FuelFluid): number {
  let drop = 0
  for (const h of supply.hoses) drop += hoseDrop(h, flowLph, fluid).dropKpa
  for (const c of supply.through) if (c.comp.params.resistance) drop += partDrop(c.comp.params.resistance, flowLph, fluid.densityKgM3)
  return drop
}

/** Height the fuel climbs from the pump to where the pressure is held, as pressure: ρ·g·Δz. */
export function climbKpa(pump: CompInfo, holder: CompInfo | null, densityKgM3: number): number {
  if (!holder) return 0
  return (densityKgM3 * STANDARD_GRAVITY * (holder.comp.position.z - pump.comp.position.z)) / 1000 / 1000
}

/**
 * Where the pump works against a rail pressure: the flow Q with Q = curve(rail + climb + drop(Q)).
 * The curve falls with pressure and the drop rises with flow, so there is one answer; bisection finds it.
 */
export function operatingPoint(
  curve: readonly FuelPumpPoint[], supply: Walk, railPressureKpa: number, climb: number, fluid: FuelFluid,
): FuelOperatingPoint {
  const flowAt = (q: number) => pumpFlowAt(curve, railPressureKpa + climb + supplyDropKpa(supply, q, fluid))
  let lo = 0
  let hi = pumpFlowAt(curve, railPressureKpa + climb)
  for (let i = 0; i < 60 && hi - lo > 1e-9; i++) {
    const mid = (lo + hi) / 2
    if (flowAt(mid) > mid) lo = mid
    else hi = mid
  }
  const q = (lo + hi) / 2
  const drop = supplyDropKpa(supply, q, fluid)
  return { railPressureKpa, pumpFlowLph: q, pumpOutletKpa: railPressureKpa + climb + drop, supplyDropKpa: drop, climbKpa: climb }
}
