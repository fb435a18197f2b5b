// Fittings, plugs, reducers, thermostats and caps, from the engine's counts and findings.
import type { CircuitDocument, Component, Port } from '../circuit'
import type { CountLine, FixAction, Report } from '../engine'
import { capitalise, num, pieces, pressureText, sizeChain, slug, temperatureText } from './format'
import { mmFigures } from './hoseLines'
import type { ShopSection, ShoppingLine } from './types'

/** Which section each of the engine's fitting items is listed in. */
const SECTION_OF_ITEM: Record<string, ShopSection> = {
  reducer: 'reducers',
  tee: 'tees',
  'bleed valve': 'bleed',
  'bleed screw': 'bleed',
  'blanking plug': 'plugs',
  'blanking cap': 'plugs',
  'filler cap': 'plugs',
  'drain tap': 'drains',
  'drain plug': 'drains',
  'heater valve': 'valves',
  'bulkhead fitting': 'tank-fittings',
  'vent valve': 'tank-fittings',
  'port plug': 'plugs',
}

/** Items the engine lists for a blocked port: one per port, sized by its spigot. */
const PORT_ITEMS = new Set(['bleed screw', 'blanking cap', 'filler cap', 'drain plug', 'vent valve', 'port plug'])

export interface DocumentIndex {
  components: Map<string, Component>
  ports: Map<string, { port: Port; comp: Component }>
}

export function indexDocument(doc: CircuitDocument): DocumentIndex {
  const components = new Map<string, Component>()
  const ports = new Map<string, { port: Port; comp: Component }>()
  for (const c of doc.circuit.components) {
    components.set(c.id, c)
    for (const p of c.ports) ports.set(p.id, { port: p, comp: c })
  }
  return { components, ports }
}

const portLabel = (idx: DocumentIndex, id: string): string => {
  const p = idx.ports.get(id)
  return p ? `${p.comp.label} › ${p.port.name}` : id
}

function fittingLine(c: CountLine, idx: DocumentIndex): ShoppingLine {
  const section = SECTION_OF_ITEM[c.item] ?? 'other'
  const onPort = PORT_ITEMS.has(c.item)
  const ids = [...new Set(c.elementIds)]
  const where = ids.map((id) => (onPort ? portLabel(idx, id) : idx.components.get(id)?.label ?? id)).join('; ')
  // a port item's size is its spigot; read it from the drawing rather than from the engine's wording
  const spigot = onPort ? idx.ports.get(ids[0] ?? '')?.port.spigotOdMm : undefined
  const figures = spigot !== undefined ? [spigot] : mmFigures(c.size)
  const sizes = figures.length > 0 ? sizeChain(figures, onPort ? ' spigot' : '') : { metric: c.size, imperial: c.size }
  return {
    id: `fitting/${slug(c.item)}/${onPort ? ids.join('+') : slug(c.size)}`,
    section,
    parentId: null,
    description: `${capitalise(c.item)}, ${sizes.metric}`,
    quantity: c.count,
    unit: 'piece',
    sizes,
    quantityText: pieces(c.count),
    source: 'engine',
    price: null,
    supplier: null,
    notes: `For ${where}.`,
    elementIds: ids,
  }
}

export function fittingLines(report: Report, idx: DocumentIndex): ShoppingLine[] {
  return report.quantities.fittings.map((c) => fittingLine(c, idx))
}

type ReducerAction = Extract<FixAction, { type: 'add-reducer' }>

/** A reducer (or stepped hose) for every size step the size-mismatch findings ask for, one line per step. */
export function reducerLinesFromFindings(report: Report, idx: DocumentIndex): ShoppingLine[] {
  const steps = new Map<string, { action: ReducerAction; elementIds: string[]; where: string[] }>()
  for (const f of report.findings) {
    const a = f.fix.action
    if (f.code !== 'size-mismatch' || a?.type !== 'add-reducer') continue
    const key = `${a.hoseBoreMm.toFixed(2)}-${a.spigotOdMm.toFixed(2)}`
    const step = steps.get(key) ?? { action: a, elementIds: [], where: [] }
    step.elementIds.push(...f.elementIds)
    const portId = f.elementIds.find((id) => idx.ports.has(id))
    step.where.push(`${report.quantities.hoses.find((h) => h.hoseId === a.hoseId)?.tag ?? a.hoseId} on ${portId ? portLabel(idx, portId) : 'its port'}`)
    steps.set(key, step)
  }
  return [...steps.entries()].map(([key, s]) => {
    const sizes = sizeChain([s.action.hoseBoreMm, s.action.spigotOdMm])
    return {
      id: `reducer/${key}`,
      section: 'reducers',
      parentId: null,
      description: `Reducer or stepped hose, ${num(s.action.hoseBoreMm)} mm hose to ${num(s.action.spigotOdMm)} mm spigot`,
      quantity: s.where.length,
      unit: 'piece',
      sizes: { metric: `hose ${sizes.metric.replace(' → ', ' mm → spigot ')}`, imperial: `hose ${sizes.imperial.replace(' → ', ' in → spigot ')}` },
      quantityText: pieces(s.where.length),
      source: 'engine',
      price: null,
      supplier: null,
      notes: `Size step found by the size-mismatch check: ${s.where.join('; ')}.`,
      elementIds: [...new Set(s.elementIds)],
    } satisfies ShoppingLine
  })
}

export function thermostatLines(report: Report): ShoppingLine[] {
  return report.quantities.thermostats.map((t) => {
    const open = temperatureText(t.openingTempC)
    const full = temperatureText(t.fullOpenTempC)
    return {
      id: `thermostat/${t.componentId}`,
      section: 'thermostat',
      parentId: null,
      description: `Thermostat for ${t.label}, stamped ${open.metric}`,
      quantity: 1,
      unit: 'piece',
      sizes: { metric: `opens ${open.metric}, fully open ${full.metric}`, imperial: `opens ${open.imperial}, fully open ${full.imperial}` },
      quantityText: pieces(1),
      source: 'engine',
      price: null,
      supplier: null,
      notes: t.hasBypass ? 'With a jiggle valve or bleed hole, as drawn.' : 'No jiggle valve or bleed hole in the drawing.',
      elementIds: [t.componentId],
    } satisfies ShoppingLine
  })
}

export function capLines(report: Report): ShoppingLine[] {
  return report.quantities.caps.map((c) => {
    const sizes = pressureText(c.ratingKpa)
    return {
      id: `cap/${c.componentId}`,
      section: 'cap',
      parentId: null,
      description: `Pressure cap for ${c.label}, ${sizes.metric}`,
      quantity: 1,
      unit: 'piece',
      sizes,
      quantityText: pieces(1),
      source: 'engine',
      price: null,
      supplier: null,
      notes: 'Rating is gauge pressure, as stamped on the cap.',
      elementIds: [c.componentId],
    } satisfies ShoppingLine
  })
}
