// The fuel parts of a fuel circuit's shopping list: pump, filters, regulator, injectors and rail, each
// with the figure it must be bought to (from the drawing's params and the engine's fuel figures), and
// the pressure class a fuel hose is bought in. The tank is the car's own and is not bought.
import type { CircuitDocument, Component, HoseMaterial } from '../circuit'
import { FUEL_HOSE_RATINGS, type FuelQuantities, type Report } from '../engine'
import { inchText, mmText, num, pieces, pressureText } from './format'
import type { DualText, ShopSection, ShoppingLine } from './types'

/** 1 US gallon = 3.785411784 L (exact, by definition). */
const LITRES_PER_US_GALLON = 3.785411784
/** 1 lb = 453.59237 g (exact, by definition). */
const GRAMS_PER_POUND = 453.59237

const flowText = (lph: number): DualText => ({ metric: `${num(lph, 0)} L/h`, imperial: `${num(lph / LITRES_PER_US_GALLON, 1)} US gal/h` })
const at = (flow: DualText, kpa: number): DualText => {
  const p = pressureText(kpa)
  return { metric: `${flow.metric} at ${p.metric}`, imperial: `${flow.imperial} at ${p.imperial}` }
}
const spigots = (c: Component): DualText => {
  const sizes = [...new Set(c.ports.filter((p) => !p.blocked).map((p) => p.spigotOdMm))]
  if (sizes.length === 0) return { metric: '', imperial: '' }
  return { metric: `${sizes.map(mmText).join(' / ')} spigots`, imperial: `${sizes.map(inchText).join(' / ')} spigots` }
}
const joinSizes = (...parts: DualText[]): DualText => ({
  metric: parts.map((p) => p.metric).filter(Boolean).join(', '),
  imperial: parts.map((p) => p.imperial).filter(Boolean).join(', '),
})

function line(id: string, section: ShopSection, description: string, quantity: number, sizes: DualText, notes: string, elementIds: string[]): ShoppingLine {
  return {
    id, section, parentId: null, description, quantity, unit: 'piece', sizes, quantityText: pieces(quantity),
    source: 'engine', price: null, supplier: null, notes, elementIds,
  }
}

function pumpLine(c: Component, fuel: FuelQuantities): ShoppingLine | null {
  if (c.type !== 'in-tank-pump' && c.type !== 'inline-pump') return null
  const main = fuel.pump?.componentId === c.id ? fuel.pump : null
  const need = main?.requiredLph ?? null
  const sizes = need !== null && main ? at(flowText(need), main.full.pumpOutletKpa) : at(flowText(c.params.curve[0]!.flowLph), c.params.curve[0]!.pressureKpa)
  const curve = c.params.curve.map((p) => `${num(p.flowLph, 0)} L/h at ${pressureText(p.pressureKpa).metric}`).join(', ')
  const notes = need !== null && main
    ? `Must deliver at least ${sizes.metric} (${sizes.imperial}): the engine's burn at the target power plus a ${num(main.marginPercent, 0)} % margin, against rail pressure, line drop and climb. As drawn: ${curve}.`
    : `As drawn: ${curve}.`
  const kind = c.type === 'in-tank-pump' ? 'in-tank, with its strainer sock and hanger seal' : 'inline, mounted below the tank outlet'
  return line(`fuel-pump/${c.id}`, 'fuel-pump', `Fuel pump (${kind}) for ${c.label}`, 1, sizes, notes, [c.id])
}

function filterLine(c: Component, fuel: FuelQuantities): ShoppingLine | null {
  if (c.type !== 'fuel-filter') return null
  const place = fuel.parts.find((p) => p.componentId === c.id)?.place ?? 'elsewhere'
  const rail = fuel.regulator?.railFullKpa
  const notes = place === 'after the pump'
    ? `On the pressure side: a filter housing rated for injection pressure${rail ? ` (at least ${pressureText(rail).metric}, ${pressureText(rail).imperial})` : ''}, flow arrow towards the rail.`
    : place === 'before the pump' ? 'Before the pump: a coarse pre-filter only, so the pump\'s inlet is not restricted.' : 'Flow arrow in the direction of flow.'
  const micron: DualText = { metric: `${num(c.params.micron, 0)} µm`, imperial: `${num(c.params.micron, 0)} µm` }
  return line(`filter/${c.id}`, 'filters', `Fuel filter, ${num(c.params.micron, 0)} µm, for ${c.label}`, 1, joinSizes(micron, spigots(c)), notes, [c.id])
}

function regulatorLine(c: Component, fuel: FuelQuantities): ShoppingLine | null {
  if (c.type !== 'fuel-regulator') return null
  const base = pressureText(c.params.basePressureKpa)
  const ref = c.params.reference === 'manifold' ? 'manifold-referenced (fuel pressure rises 1:1 with boost)' : 'not referenced'
  const style = c.params.style === 'return' ? 'return-style' : 'returnless'
  const boost = fuel.demand?.maxBoostKpa ?? 0
  const notes = c.params.reference === 'manifold' && boost > 0 && fuel.regulator?.componentId === c.id
    ? `Rail pressure at full boost ${pressureText(fuel.regulator.railFullKpa).metric} (${pressureText(fuel.regulator.railFullKpa).imperial}). A 1:1 unit, not a "rising-rate" one (those rise faster than boost).`
    : 'Base pressure with the manifold at atmosphere.'
  return line(`regulator/${c.id}`, 'regulator', `Fuel pressure regulator, ${style}, ${ref}, for ${c.label}`, 1,
    joinSizes({ metric: `base ${base.metric}`, imperial: `base ${base.imperial}` }, spigots(c)), notes, [c.id])
}

function injectorLine(c: Component, fuel: FuelQuantities): ShoppingLine | null {
  if (c.type === 'fuel-rail') return line(`rail/${c.id}`, 'injectors', `Fuel rail: ${c.label}`, 1, spigots(c), 'With its mounting brackets and a test valve for a gauge.', [c.id])
  if (c.type !== 'injector') return null
  const p = c.params
  const rho = fuel.fuel.densityKgL
  const lbH = (p.ratedFlowCcMin * rho * 60) / GRAMS_PER_POUND
  const rated = pressureText(p.ratedPressureKpa)
  const sizes: DualText = { metric: `${num(p.ratedFlowCcMin, 0)} cc/min at ${rated.metric}`, imperial: `${num(lbH, 1)} lb/h at ${rated.imperial}` }
  const need = fuel.injectors?.neededRatedCcMin
  const notes = `lb/h at ${num(rho, 3)} kg/L (${fuel.fuel.name}). ` +
    (need != null ? `The target power needs at least ${num(Math.ceil(need), 0)} cc/min each at that rating. ` : '') +
    'With new O-rings, lubricated with clean fuel or the maker\'s grease, never oil.'
  return line(`injector/${c.id}`, 'injectors', `Injector for ${c.label}`, p.count, sizes, notes, [c.id])
}

/** Pump, filters, regulator, rail and injectors, in the order they are drawn. */
export function fuelPartLines(doc: CircuitDocument, report: Report): ShoppingLine[] {
  const fuel = report.quantities.fuel
  if (!fuel) return []
  return doc.circuit.components.flatMap((c) => {
    const l = pumpLine(c, fuel) ?? filterLine(c, fuel) ?? regulatorLine(c, fuel) ?? injectorLine(c, fuel)
    return l ? [l] : []
  })
}

/**
 * The pressure class a fuel hose group is bought in, from the hose ratings the hose-not-fuel-rated
 * check uses: words for the description and the working pressure for the sizes; null for a hose
 * that is not fuel hose or where the tube, not a rating, decides (hard line).
 */
export function fuelHoseClass(report: Report, material: HoseMaterial): { words: string; sizes: DualText } | null {
  if (!report.quantities.fuel) return null
  const r = FUEL_HOSE_RATINGS[material]
  if (!r.fuel || r.workingKpa === null) return null
  const p = pressureText(r.workingKpa)
  return {
    words: r.pressureSide ? 'injection pressure class' : 'low-pressure class, not for the pressure side',
    sizes: { metric: `up to ${p.metric} working`, imperial: `up to ${p.imperial} working` },
  }
}
