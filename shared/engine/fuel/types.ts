// What the engine works out for a fuel circuit, in the report's quantities (`quantities.fuel`).
// Flows in L/h and cc/min as the trade states them; pressures kPa gauge.
import type { FuelKind, RegulatorReference, RegulatorStyle } from '../../circuit'
import type { FuelSide } from './layout'

export interface FuelOperatingPoint {
  /** pressure the regulator holds at the rail */
  railPressureKpa: number
  /** the pump's flow there, from its curve, after the supply line's own drop */
  pumpFlowLph: number
  /** what the pump pushes against: rail pressure + line drop + the climb from pump to regulator */
  pumpOutletKpa: number
  supplyDropKpa: number
  climbKpa: number
}

export interface FuelLineFlow {
  hoseId: string
  tag: string
  side: FuelSide
  /** the worse of idle and full power for this side: idle for suction, supply and return (the pump's whole flow), full power where only the engine's burn flows */
  at: 'idle' | 'full power'
  flowLph: number
  velocityMS: number
  reynolds: number
  /** friction and bends in the hose itself at that flow */
  dropKpa: number
  /** the velocity limit for the side (thresholds) */
  limitMS: number
}

export interface InjectorSet {
  componentId: string
  label: string
  count: number
  ratedFlowCcMin: number
  ratedPressureKpa: number
  /** each injector's flow at the pressure across it at full power: rated × √(Δp / Δp rated) */
  flowAtFullCcMin: number
}

export type FuelPartRole = 'tank' | 'pump' | 'filter' | 'regulator' | 'rail' | 'injectors'
export type FuelPlace = 'before the pump' | 'after the pump' | 'on the return' | 'elsewhere'

/** A fuel part to buy or check, by id; the shopping list reads its figures from the drawing. */
export interface FuelPartLine {
  componentId: string
  label: string
  role: FuelPartRole
  /** where it sits; for filters the place decides the rating it needs */
  place: FuelPlace
}

export interface FuelQuantities {
  fuel: { kind: FuelKind; name: string; densityKgL: number; ethanolPercent: number; viscosityPaS: number; source: string }
  /** what the engine burns at the target power; null without fuel settings */
  demand: {
    powerKw: number
    powerHp: number
    bsfcGPerKwh: number
    bsfcLbPerHpH: number
    massKgH: number
    volumeLph: number
    maxDutyPercent: number
    maxBoostKpa: number
  } | null
  regulator: {
    componentId: string
    label: string
    basePressureKpa: number
    reference: RegulatorReference
    style: RegulatorStyle
    railIdleKpa: number
    railFullKpa: number
    /** rail pressure minus manifold pressure at full boost: base for a 1:1 referenced regulator, base − boost otherwise */
    injectorDeltaPFullKpa: number
  } | null
  pump: {
    componentId: string
    label: string
    type: 'in-tank-pump' | 'inline-pump'
    idle: FuelOperatingPoint
    full: FuelOperatingPoint
    /** demand × (1 + margin); null without a demand */
    requiredLph: number | null
    marginPercent: number
  } | null
  injectors: {
    sets: InjectorSet[]
    count: number
    /** what each injector must deliver at the target power, cc/min */
    demandPerInjectorCcMin: number | null
    /** share of the time they are open at the target power, %; null without a demand or a regulator */
    dutyPercent: number | null
    /** the smallest rating, at the first set's rated pressure, that keeps within the duty limit */
    neededRatedCcMin: number | null
  } | null
  /** the surplus the regulator sends back: at idle nearly the pump's whole flow, at full power that less the burn */
  returnLph: { idle: number; full: number } | null
  lines: FuelLineFlow[]
  /** tanks, pumps, filters, regulators, rails and injectors in stable order */
  parts: FuelPartLine[]
  /** how the flows were estimated, in words for the report */
  model: string
}
