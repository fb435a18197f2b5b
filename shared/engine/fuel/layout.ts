// The sides of a fuel circuit, found by walking the drawing (walk.ts): which hoses are the suction of an
// inline pump, which carry the pump's whole flow to the regulator (supply), which carry only what the
// engine burns (regulated: downstream of a regulator's feed-on ports, as in a returnless layout), and
// which take the surplus back to the tank (return). Built once per analysis of a fuel circuit.
import type { AnalysisContext } from '../context'
import type { CompInfo, HoseInfo, PortInfo } from '../model'
import {
  defaultOnward, isPump, isRegulator, isReturnPort, isTank, pumpInlets, pumpOutlets, walkFrom, type Walk,
} from './walk'

export type FuelSide = 'suction' | 'supply' | 'regulated' | 'return'

export interface PumpLayout {
  pump: CompInfo
  /** from its outlets to the regulators, rails' ends, tanks … (regulators end it) */
  supply: Walk
  /** an inline pump's inlet line back to the tank; null for an in-tank pump */
  suction: Walk | null
  /** regulators its supply reaches, and by which port */
  regulators: Array<{ reg: CompInfo; port: PortInfo }>
}

export interface RegulatorLayout {
  reg: CompInfo
  /** its `outlet` ports: the return */
  returnPorts: PortInfo[]
  /** from its return ports towards the tank */
  ret: Walk
  returnsToTank: boolean
  /** from its feed-on ports (not the ones a pump's supply arrives by, not the return) */
  feed: Walk
  fedBy: PumpLayout[]
}

export interface FuelLayout {
  pumps: PumpLayout[]
  /** the pump the demand checks use: the first (stable order) whose supply reaches a regulator or a rail */
  main: PumpLayout | null
  regulators: RegulatorLayout[]
  /** the regulator that sets the rail pressure: the first the main pump reaches, else the first drawn */
  mainRegulator: RegulatorLayout | null
  injectors: CompInfo[]
  rails: CompInfo[]
  /** each classified hose's side; a hose reached by several walks keeps the first, in the order supply, regulated, return, suction */
  sideOf: Map<HoseInfo, FuelSide>
}

const reachesRail = (w: Walk) => w.through.some((c) => c.comp.type === 'fuel-rail') || w.reached.some((a) => a.comp.comp.type === 'injector')

export function fuelLayout(ctx: AnalysisContext): FuelLayout {
  const comps = ctx.model.components
  const pumps: PumpLayout[] = comps.filter(isPump).map((pump) => {
    const supply = walkFrom(ctx, pumpOutlets(pump))
    const suction = pump.comp.type === 'inline-pump' ? walkFrom(ctx, pumpInlets(pump)) : null
    const regulators = supply.reached.filter((a) => isRegulator(a.comp) && !isReturnPort(a.port)).map((a) => ({ reg: a.comp, port: a.port }))
    return { pump, supply, suction, regulators }
  })
  const regulators: RegulatorLayout[] = comps.filter(isRegulator).map((reg) => {
    const returnPorts = reg.ports.filter(isReturnPort)
    const ret = walkFrom(ctx, returnPorts.filter((p) => !p.port.blocked))
    const fedBy = pumps.filter((p) => p.regulators.some((r) => r.reg === reg))
    const entered = new Set(fedBy.flatMap((p) => p.regulators.filter((r) => r.reg === reg).map((r) => r.port)))
    const feedPorts = fedBy.length === 0 ? [] : reg.ports.filter((p) => !entered.has(p) && !p.port.blocked && !isReturnPort(p))
    const feed = walkFrom(ctx, feedPorts, defaultOnward)
    return { reg, returnPorts, ret, returnsToTank: ret.reached.some((a) => isTank(a.comp)), feed, fedBy }
  })
  const main = pumps.find((p) => p.regulators.length > 0 || reachesRail(p.supply)) ?? null
  const firstReg = main?.regulators[0]?.reg
  const mainRegulator = regulators.find((r) => r.reg === firstReg) ?? regulators[0] ?? null
  const sideOf = new Map<HoseInfo, FuelSide>()
  const mark = (hoses: readonly HoseInfo[], side: FuelSide) => { for (const h of hoses) if (!sideOf.has(h)) sideOf.set(h, side) }
  for (const p of pumps) mark(p.supply.hoses, 'supply')
  for (const r of regulators) mark(r.feed.hoses, 'regulated')
  for (const r of regulators) mark(r.ret.hoses, 'return')
  for (const p of pumps) if (p.suction) mark(p.suction.hoses, 'suction')
  return {
    pumps, main, regulators, mainRegulator,
    injectors: comps.filter((c) => c.comp.type === 'injector'),
    rails: comps.filter((c) => c.comp.type === 'fuel-rail'),
    sideOf,
  }
}

/** Pressure-side hoses: between a pump and the regulator, and on past a regulator's feed-on ports. */
export const isPressureSide = (side: FuelSide | undefined) => side === 'supply' || side === 'regulated'
