// Whether coolant can go round at all, with the thermostat open and shut, and whether the parts a
// sealed coolant system needs are there.
import { makeFinding, type AnalysisContext, type Check } from '../context'
import type { StateGraph } from '../graph'
import { fmt, type CompInfo } from '../model'
import type { Finding } from '../report'
import { TERMINAL_TYPES } from './deadLegs'

const LOOP_TYPES = ['water-pump', 'engine', 'radiator'] as const
const TYPE_WORDS: Record<(typeof LOOP_TYPES)[number], string> = { 'water-pump': 'water pump', engine: 'engine', radiator: 'radiator' }

/** Class of the pump's suction, or null when the pump edge is a bridge (nothing can come back to it). */
export function pumpLoopClass(ctx: AnalysisContext, g: StateGraph): number | null {
  const pump = ctx.pump
  if (!pump) return null
  const cls = g.classOf[ctx.graph.partNode[pump.rank]!]!
  return g.classOf[ctx.graph.dischargeNode] === cls ? cls : null
}

export function onPumpLoop(ctx: AnalysisContext, g: StateGraph, c: CompInfo): boolean {
  const cls = pumpLoopClass(ctx, g)
  if (cls === null) return false
  return g.classOf[ctx.graph.partNode[c.rank]!] === cls
}

/** True when the pump, every engine and every radiator share one closed loop (thermostat open). */
export function circulates(ctx: AnalysisContext): boolean {
  if (ctx.doc.circuit.kind !== 'coolant' || !ctx.pump) return false
  const needed = ctx.model.components.filter((c) => c.comp.type === 'engine' || c.comp.type === 'radiator')
  if (!needed.some((c) => c.comp.type === 'engine') || !needed.some((c) => c.comp.type === 'radiator')) return false
  return pumpLoopClass(ctx, ctx.open) !== null && needed.every((c) => onPumpLoop(ctx, ctx.open, c))
}

export const noCirculation: Check = (ctx) => {
  if (ctx.doc.circuit.kind !== 'coolant' || circulates(ctx)) return []
  const missing = LOOP_TYPES.filter((t) => !ctx.model.components.some((c) => c.comp.type === t))
  const offLoop = ctx.model.components.filter(
    (c) => c.comp.ports.length > 0 && !TERMINAL_TYPES.has(c.comp.type) && c.comp.type !== 'blanking-plug' && !onPumpLoop(ctx, ctx.open, c),
  )
  const parts: string[] = []
  if (missing.length > 0) parts.push(`the circuit has no ${missing.map((t) => TYPE_WORDS[t]).join(', no ')}`)
  if (ctx.pump && pumpLoopClass(ctx, ctx.open) === null) parts.push(`nothing that leaves ${ctx.pump.comp.label} can come back to its inlet`)
  if (offLoop.length > 0) parts.push(`not on a closed loop with the pump: ${offLoop.map((c) => c.comp.label).join(', ')}`)
  return [
    makeFinding(
      ctx, 'no-circulation', 'error',
      `Coolant cannot circulate through the water pump, the engine and the radiator: ${parts.join('; ')}.`,
      offLoop.map((c) => c.comp.id),
      'Join hoses so coolant leaves the pump, passes through the engine and the radiator, and comes back to the pump inlet.',
    ),
  ]
}

export const noWarmUpBypass: Check = (ctx) => {
  if (!circulates(ctx)) return []
  const out: Finding[] = []
  const shutLoop = pumpLoopClass(ctx, ctx.closed)
  for (const t of ctx.model.components) {
    if (t.comp.type !== 'thermostat' || t.comp.params.hasBypass) continue
    const reasons: string[] = []
    const ids = [t.comp.id]
    if (shutLoop === null) reasons.push(`the pump has no way back to its inlet, so it churns against a closed valve`)
    else {
      const starved = ctx.model.components.filter((c) => c.comp.type === 'engine' && !onPumpLoop(ctx, ctx.closed, c))
      if (starved.length > 0) {
        reasons.push(`no coolant moves through ${starved.map((c) => c.comp.label).join(', ')}, so it forms hot spots`)
        ids.push(...starved.map((c) => c.comp.id))
      }
      if (!onPumpLoop(ctx, ctx.closed, t)) reasons.push(`no coolant reaches the sensing side of ${t.comp.label}, so it opens late and the engine overheats first`)
    }
    if (reasons.length === 0) continue
    out.push(
      makeFinding(
        ctx, 'no-warm-up-bypass', 'warning',
        `While ${t.comp.label} is shut (below ${fmt(t.comp.params.openingTempC, 0)} °C) ${reasons.join('; ')}.`,
        ids,
        `Add a bypass hose from the engine side of ${t.comp.label} back to the pump inlet (or use a thermostat with a bypass valve), so coolant circulates through the engine past the thermostat while it warms up.`,
      ),
    )
  }
  return out
}

export const missingParts: Check = (ctx) => {
  if (ctx.doc.circuit.kind !== 'coolant') return []
  const has = (type: string) => ctx.model.components.some((c) => c.comp.type === type)
  const out: Finding[] = []
  if (!has('thermostat')) {
    out.push(makeFinding(ctx, 'no-thermostat', 'warning',
      'The circuit has no thermostat: the engine will run cold, wear faster and the heater will blow lukewarm.',
      [], 'Fit a thermostat at the engine outlet to the radiator, with a bypass back to the pump.'))
  }
  const capped = ctx.model.components.filter((c) => c.comp.type === 'pressure-cap' || (c.comp.type === 'expansion-tank' && c.comp.params.capRatingKpa !== undefined))
  const rating = ctx.doc.circuit.settings.coolant?.capRatingKpa ?? 0
  if (capped.length === 0) {
    out.push(makeFinding(ctx, 'no-pressure-cap', 'warning',
      'The circuit has no pressure cap: without pressure the coolant boils at about 100 °C and the margin to boiling is gone.',
      [], `Fit a pressure cap (the settings assume ${fmt(rating, 0)} kPa) on the expansion tank or a filler neck at the highest point.`,
      { type: 'set-cap-rating', capRatingKpa: rating }))
  }
  for (const c of capped) {
    const fitted = c.comp.type === 'pressure-cap' ? c.comp.params.ratingKpa : c.comp.type === 'expansion-tank' ? c.comp.params.capRatingKpa! : 0
    if (Math.abs(fitted - rating) > 1) {
      out.push(makeFinding(ctx, 'cap-rating-mismatch', 'warning',
        `The cap on ${c.comp.label} is rated ${fmt(fitted, 0)} kPa but the circuit settings use ${fmt(rating, 0)} kPa for the boiling point.`,
        [c.comp.id], `Set the circuit's cap rating to the cap actually fitted (${fmt(fitted, 0)} kPa), or fit a ${fmt(rating, 0)} kPa cap.`,
        { type: 'set-cap-rating', capRatingKpa: fitted }))
    }
  }
  if (!has('expansion-tank') && !has('overflow-bottle') && !has('deaeration-pot')) {
    out.push(makeFinding(ctx, 'no-expansion-space', 'warning',
      'The circuit has no expansion tank, overflow bottle or de-aeration pot: hot coolant expands by several percent and will be pushed out past the cap.',
      [], 'Fit a pressurised expansion tank at the highest point, or an overflow bottle on the cap’s overflow spigot.'))
  }
  return out
}
