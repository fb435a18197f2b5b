// Fuel checks on the drawing's layout: a return-style regulator with no way back to the tank, filters in
// the wrong place, hose that is not made for fuel or for the pressure it sits under.
import { distanceMm } from '../../circuit'
import { makeFinding, type AnalysisContext } from '../context'
import { fmt, hoseName, portName, type CompInfo, type PortInfo } from '../model'
import { kpaToPsi } from '../physics'
import type { Finding } from '../report'
import { FUEL_HOSE_RATINGS, suitableFuelHose } from './hoseRatings'
import { isPressureSide, type FuelLayout, type RegulatorLayout } from './layout'
import type { FuelQuantities } from './types'
import { isTank, pressureOnward, pumpOutlets, walkFrom } from './walk'

export const pressureText = (kpa: number) => `${fmt(kpa, 0)} kPa (${fmt(kpaToPsi(kpa), 1)} psi)`

/** Open ports a return line can end at: a tank's inlet or spare spigot, or a bulkhead fitting's spigot. */
function returnInlets(ctx: AnalysisContext): PortInfo[] {
  return ctx.model.ports.filter((p) => !p.joined && !p.port.blocked && isTank(p.comp)
    && (p.comp.comp.type === 'bulkhead-fitting' ? true : p.port.role === 'inlet' || p.port.role === 'either'))
}

function whyNoReturn(r: RegulatorLayout): string {
  if (r.returnPorts.length === 0) return 'it has no return port (a port marked as an outlet)'
  const open = r.returnPorts.filter((p) => !p.port.blocked)
  if (open.length === 0) return `its return port ${portName(r.returnPorts[0]!)} is plugged`
  const unjoined = open.find((p) => !p.joined)
  if (unjoined && open.every((p) => !p.joined)) return `nothing is joined to ${portName(unjoined)}`
  if (r.ret.freeEnds.length > 0) return `the line from ${portName(open[0]!)} ends at a free end of ${hoseName(r.ret.freeEnds[0]!)}`
  const elsewhere = r.ret.reached.map((a) => a.comp.comp.label)
  return `the line from ${portName(open[0]!)} leads to ${elsewhere.length > 0 ? elsewhere.join(', ') : 'nothing'}, not to the tank`
}

export function noReturnLine(ctx: AnalysisContext, layout: FuelLayout): Finding[] {
  const out: Finding[] = []
  const inlets = returnInlets(ctx)
  for (const r of layout.regulators) {
    const reg = r.reg.comp
    if (reg.type !== 'fuel-regulator' || reg.params.style !== 'return' || r.returnsToTank) continue
    const from = r.returnPorts.find((p) => !p.port.blocked && !p.joined)
    let to: PortInfo | undefined
    for (const p of inlets) if (from && (!to || distanceMm(p.world, from.world) < distanceMm(to.world, from.world))) to = p
    const ids = [reg.id, ...r.returnPorts.map((p) => p.port.id), ...(to ? [to.port.id] : [])]
    out.push(makeFinding(ctx, 'no-return-line', 'error',
      `${reg.label} is a return-style regulator, but nothing takes its surplus back to the tank: ${whyNoReturn(r)}. ` +
      'Without a return the pump pushes against a closed end and the rail pressure climbs past the regulator’s setting.',
      ids,
      from && to
        ? `Run a return hose from ${portName(from)} to ${portName(to)}.`
        : 'Run a return hose from the regulator’s return port to the tank: a return spigot on the tank, or a bulkhead fitting through its top.',
      from && to ? { type: 'join-ports', fromPortId: from.port.id, toPortId: to.port.id, label: 'Return line' } : undefined))
  }
  return out
}

const fineEnough = (ctx: AnalysisContext, c: CompInfo) => c.comp.type === 'fuel-filter' && c.comp.params.micron <= ctx.thresholds.fineFilterMicron

export function filterPlacement(ctx: AnalysisContext, layout: FuelLayout): Finding[] {
  const out: Finding[] = []
  const fine = ctx.thresholds.fineFilterMicron
  const coarse = ctx.thresholds.strainerMinMicron
  for (const p of layout.pumps) {
    // past the pump: can fuel reach a rail or an injector without passing a fine filter?
    const open = walkFrom(ctx, pumpOutlets(p.pump), (c, entered) => (fineEnough(ctx, c) ? null : pressureOnward(c, entered)))
    const rail = open.through.find((c) => c.comp.type === 'fuel-rail') ?? open.reached.find((a) => a.comp.comp.type === 'injector')?.comp
    if (rail) {
      const loose = open.through.filter((c) => c.comp.type === 'fuel-filter')
      const coarseText = loose.length > 0 ? ` (${loose.map((c) => `${c.comp.label} is ${fmt(c.comp.type === 'fuel-filter' ? c.comp.params.micron : 0, 0)} µm`).join(', ')})` : ''
      out.push(makeFinding(ctx, 'filter-placement', 'warning',
        `No fine filter between ${p.pump.comp.label} and ${rail.comp.label}: fuel reaches the injectors with nothing finer than ${fmt(fine, 0)} µm on the way${coarseText}. ` +
        'Dirt from an old tank and its lines, and wear from the pump itself, block and wear injectors.',
        [p.pump.comp.id, rail.comp.id, ...open.hoses.map((h) => h.hose.id)],
        `Fit a fine filter (about 10 µm, the usual rating for injection) in the pressure line after ${p.pump.comp.label} and before ${rail.comp.label}.`))
    }
    // before the pump: only a coarse strainer belongs there
    const before = p.suction?.through.filter((c) => c.comp.type === 'fuel-filter' && c.comp.params.micron < coarse) ?? []
    for (const f of before) {
      const micron = f.comp.type === 'fuel-filter' ? f.comp.params.micron : 0
      out.push(makeFinding(ctx, 'filter-placement', 'warning',
        `${f.comp.label} (${fmt(micron, 0)} µm) sits before the inlet of ${p.pump.comp.label}: a fine element there restricts the inlet as it fills, the pump starves and the fuel vapours. Only a coarse strainer (${fmt(coarse, 0)} µm or coarser) belongs before a pump.`,
        [f.comp.id, p.pump.comp.id],
        `Move ${f.comp.label} to the pressure side after the pump, and fit a coarse pre-filter (about 100 µm) before the pump.`))
    }
    const sock = p.pump.comp.type === 'in-tank-pump' ? p.pump.comp.params.strainerMicron : undefined
    if (sock !== undefined && sock < coarse) {
      out.push(makeFinding(ctx, 'filter-placement', 'warning',
        `The strainer on ${p.pump.comp.label} is ${fmt(sock, 0)} µm: a fine sock on an in-tank pump's inlet restricts it as it fills, and the pump starves. Only a coarse strainer (${fmt(coarse, 0)} µm or coarser) belongs before a pump.`,
        [p.pump.comp.id],
        'Fit the usual coarse sock (about 100 µm) and do the fine filtering after the pump.'))
    }
  }
  return out
}

export function hoseNotFuelRated(ctx: AnalysisContext, layout: FuelLayout, q: FuelQuantities): Finding[] {
  const out: Finding[] = []
  const ethanol = q.fuel.ethanolPercent
  const rail = q.regulator?.railFullKpa ?? 0
  for (const h of ctx.model.hoses) {
    const rating = FUEL_HOSE_RATINGS[h.hose.material]
    const pressure = isPressureSide(layout.sideOf.get(h))
    const reasons: string[] = []
    let severity: 'error' | 'warning' = 'warning'
    if (!rating.fuel) {
      reasons.push('a coolant class, not made for fuel: petrol swells and softens it until it weeps and splits')
      severity = 'error'
    } else if (pressure && !rating.pressureSide) {
      reasons.push(`a low-pressure class on the pressure side between the pump and the regulator${rail > 0 ? `, which runs at up to ${pressureText(rail)}` : ''}: it is not made for injection pressure and can burst`)
      severity = 'error'
    } else if (pressure && rating.workingKpa !== null && rail > rating.workingKpa) {
      reasons.push(`rated for about ${pressureText(rating.workingKpa)} working, below the ${pressureText(rail)} on the pressure side`)
      severity = 'error'
    }
    if (rating.fuel && ethanol > rating.maxEthanolPercent) {
      reasons.push(`the fuel is ${q.fuel.name} (${fmt(ethanol, 0)} % ethanol) and this class is marked for ${rating.maxEthanolPercent > 0 ? `E${rating.maxEthanolPercent}` : 'no ethanol'} at most: ethanol hardens and cracks its tube`)
    }
    if (reasons.length === 0) continue
    const better = suitableFuelHose(pressure, ethanol, rail)
    out.push(makeFinding(ctx, 'hose-not-fuel-rated', severity,
      `${capitalise(hoseName(h))} is ${rating.words}: ${reasons.join('; ')}.`,
      [h.hose.id],
      `Use ${FUEL_HOSE_RATINGS[better].words} for ${h.tag}${ethanol > 10 ? ', marked for the ethanol share' : ''}.`,
      { type: 'set-hose-material', hoseId: h.hose.id, material: better }))
  }
  return out
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1)
}
