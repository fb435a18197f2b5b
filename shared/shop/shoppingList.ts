// The shopping list: everything a technician buys for the circuit, built from the engine's report.
import type { CircuitDocument } from '../circuit'
import type { Report } from '../engine'
import { CONTAINER_RULE, DEFAULT_CONCENTRATE_CONTAINERS, DEFAULT_TOP_UP_RESERVE_PERCENT, DEFAULT_WATER_CONTAINERS } from './containers'
import { coolantLines } from './coolantLines'
import { capLines, fittingLines, indexDocument, reducerLinesFromFindings, thermostatLines } from './fittingLines'
import { fuelPartLines } from './fuelLines'
import { clampSection, hoseSection } from './hoseLines'
import { SECTION_TITLES, SHOP_SECTIONS, type CustomLineInput, type SectionTotal, type ShoppingLine, type ShoppingList, type ShoppingListOptions } from './types'

function customLine(c: CustomLineInput): ShoppingLine {
  if (!(c.quantity >= 0) || !Number.isFinite(c.quantity)) throw new Error(`custom line ${c.id}: quantity must be a number ≥ 0, got ${c.quantity}`)
  if (c.price != null && !Number.isFinite(c.price)) throw new Error(`custom line ${c.id}: price must be a number`)
  const quantity = `${c.quantity} ${c.unit}`
  return {
    id: `custom/${c.id}`,
    section: c.section ?? 'sundries',
    parentId: null,
    description: c.description,
    quantity: c.quantity,
    unit: c.unit,
    sizes: { metric: c.sizes?.metric ?? '', imperial: c.sizes?.imperial ?? '' },
    quantityText: { metric: quantity, imperial: quantity },
    source: 'custom',
    price: c.price ?? null,
    supplier: c.supplier ?? null,
    notes: c.notes ?? '',
    elementIds: [],
  }
}

/**
 * Engine lines are keyed by what the engine groups on (hose lines by the engine's own material and
 * bore key), so ids repeat only if two fitting size texts read alike once punctuation is dropped; the
 * later one gets "~2" rather than failing the list.
 */
function uniqueEngineIds(lines: ShoppingLine[]): ShoppingLine[] {
  const taken = new Set<string>()
  return lines.map((l) => {
    let id = l.id
    for (let n = 2; taken.has(id); n++) id = `${l.id}~${n}`
    taken.add(id)
    return id === l.id ? l : { ...l, id }
  })
}

/** Σ price × quantity, to the cent, so totals do not show float noise. */
const cents = (n: number): number => Math.round(n * 100) / 100

export function sectionTotals(lines: readonly ShoppingLine[]): SectionTotal[] {
  return SHOP_SECTIONS.flatMap((section) => {
    const bought = lines.filter((l) => l.section === section && l.parentId === null)
    if (bought.length === 0) return []
    const priced = bought.filter((l) => l.price !== null)
    return [{
      section,
      title: SECTION_TITLES[section],
      lines: bought.length,
      pricedLines: priced.length,
      priceTotal: priced.length > 0 ? cents(priced.reduce((s, l) => s + l.price! * l.quantity, 0)) : null,
    }]
  })
}

/** Findings that change what is bought: the list shows the drawing as it is, these say what is still to settle. */
const ATTENTION_CODES = new Set([
  'open-port', 'dangling-hose', 'size-mismatch',
  // fuel: a missing return, the wrong hose class, a pump, injectors or a filter that must be bought differently
  'no-return-line', 'hose-not-fuel-rated', 'pump-undersized', 'injector-undersized', 'filter-placement',
])

function attentionOf(report: Report): string[] {
  const out = report.findings
    .filter((f) => ATTENTION_CODES.has(f.code) && f.fix.action?.type !== 'add-reducer')
    .map((f) => `${f.message} ${f.fix.text}`)
  for (const c of report.quantities.clampCounts) {
    if (c.size.startsWith('no listed size')) out.push(`${c.count} ${c.item}(s) ${c.size}: choose a clamp by hand.`)
  }
  return out
}

/**
 * Builds the list from the report's quantities and findings; the document supplies only what the
 * report names by id (port sizes and labels). Custom lines are merged into their sections, and
 * workshop prices are applied by line id.
 */
export function shoppingList(document: CircuitDocument, report: Report, options: ShoppingListOptions = {}): ShoppingList {
  const idx = indexDocument(document)
  const reserve = options.topUpReservePercent ?? DEFAULT_TOP_UP_RESERVE_PERCENT
  if (!(reserve >= 0) || !Number.isFinite(reserve)) throw new Error(`top-up reserve must be a percentage ≥ 0, got ${reserve}`)
  const q = report.quantities
  const engineLines: ShoppingLine[] = [
    ...hoseSection(report, document.circuit.settings.allowance),
    ...clampSection(report),
    ...reducerLinesFromFindings(report, idx),
    ...fittingLines(report, idx),
    ...thermostatLines(report),
    ...capLines(report),
    ...fuelPartLines(document, report),
    ...(q.coolant
      ? coolantLines(q.coolant, q.volume.totalL, reserve,
        options.concentrateContainers ?? DEFAULT_CONCENTRATE_CONTAINERS, options.waterContainers ?? DEFAULT_WATER_CONTAINERS)
      : []),
  ]
  const custom = (options.customLines ?? []).map(customLine)
  const customIds = new Set<string>()
  for (const l of custom) {
    if (customIds.has(l.id)) throw new Error(`two custom lines share the id ${l.id}`)
    customIds.add(l.id)
  }
  const priced = [...uniqueEngineIds(engineLines), ...custom].map((l) => {
    const p = options.prices?.[l.id]
    return p && l.parentId === null ? { ...l, price: p.price, supplier: p.supplier ?? l.supplier } : l
  })
  // stable sort: engine lines keep their order within a section and custom lines follow them
  const rank = new Map(SHOP_SECTIONS.map((s, i) => [s, i]))
  const lines = priced.map((l, i) => ({ l, i })).sort((a, b) => rank.get(a.l.section)! - rank.get(b.l.section)! || a.i - b.i).map((x) => x.l)
  const sections = sectionTotals(lines)
  const totalLines = sections.reduce((s, t) => s + t.lines, 0)
  const pricedLines = sections.reduce((s, t) => s + t.pricedLines, 0)
  const anyPrice = sections.some((t) => t.priceTotal !== null)
  return {
    circuitTitle: document.circuit.title,
    engineVersion: report.engineVersion,
    lines,
    sections,
    total: {
      lines: totalLines,
      pricedLines,
      priceTotal: anyPrice ? cents(sections.reduce((s, t) => s + (t.priceTotal ?? 0), 0)) : null,
      complete: totalLines > 0 && pricedLines === totalLines,
    },
    attention: attentionOf(report),
    rules: [
      ...new Set(q.hoseTotals.map((t) => t.rule)),
      ...(q.coolant ? [`Top-up reserve: ${reserve} % of the concentrate and of the water.`, CONTAINER_RULE] : []),
      'Inch sizes are the nearest 1/16 in (marked ≈ when the metric size is not that fraction); cut lengths in inches are rounded up to the next 1/8 in.',
    ],
  }
}
