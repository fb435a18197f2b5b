// Where on the vehicle the technician fills, bleeds and drains, read from the drawing. Heights are
// above the drawing's datum: a part's z plus the port's z offset (rotation turns offsets about z only).
import type { CircuitDocument, Component, Port } from '../circuit'

export interface CircuitPoint {
  /** the part, and the port when the point is a port */
  componentId: string
  portId: string | null
  label: string
  zMm: number
}

/** Parts a technician fills through: a cap, a tank or a de-aeration pot. */
const FILLER_PARTS = new Set<Component['type']>(['pressure-cap', 'expansion-tank', 'deaeration-pot'])

const portZ = (c: Component, p: Port): number => c.position.z + p.offset.z
const topZ = (c: Component): number => Math.max(c.position.z, ...c.ports.map((p) => portZ(c, p)))
const point = (c: Component, p: Port | null): CircuitPoint => ({
  componentId: c.id, portId: p?.id ?? null, label: p ? `${c.label} › ${p.name}` : c.label, zMm: p ? portZ(c, p) : topZ(c),
})

const compareText = (a: string, b: string): number => (a < b ? -1 : a > b ? 1 : 0)

/** Lowest first; equal heights by label, then id, so the order never depends on the document's order. */
export function byHeight(a: CircuitPoint, b: CircuitPoint): number {
  const key = (x: CircuitPoint) => `${x.componentId}\u0000${x.portId ?? ''}`
  return a.zMm - b.zMm || compareText(a.label, b.label) || compareText(key(a), key(b))
}

export interface Filler extends CircuitPoint {
  component: Component
  /** a tank whose own cap holds the pressure */
  pressurisedTank: boolean
}

/**
 * Every filler: a cap, tank or pot (at its top, through its fill port when it has one), and any other
 * part's fill port. Highest first: coolant goes in at the top.
 */
export function fillers(doc: CircuitDocument): Filler[] {
  const out: Filler[] = []
  for (const c of doc.circuit.components) {
    if (c.type === 'overflow-bottle') continue
    const fillPort = c.ports.find((p) => p.role === 'fill') ?? null
    if (!FILLER_PARTS.has(c.type) && !fillPort) continue
    const at = point(c, fillPort)
    out.push({
      ...at,
      zMm: FILLER_PARTS.has(c.type) ? topZ(c) : at.zMm,
      component: c,
      pressurisedTank: c.type === 'expansion-tank' && c.params.capRatingKpa !== undefined,
    })
  }
  return out.sort((a, b) => -byHeight(a, b))
}

/**
 * Bleed points the technician opens: every blocked vent port (a bleed screw) and every bleed valve
 * without a vent port of its own. Lowest first.
 */
export function bleedPoints(doc: CircuitDocument): CircuitPoint[] {
  const out: CircuitPoint[] = []
  for (const c of doc.circuit.components) {
    const vents = c.ports.filter((p) => p.role === 'vent' && p.blocked)
    for (const p of vents) out.push(point(c, p))
    if (c.type === 'bleed-valve' && !c.ports.some((p) => p.role === 'vent')) out.push(point(c, null))
  }
  return out.sort(byHeight)
}

/** Vent ports joined by a hose: they bleed into the tank by themselves. */
export function ventLines(doc: CircuitDocument): Array<CircuitPoint & { hoseId: string }> {
  const out: Array<CircuitPoint & { hoseId: string }> = []
  for (const c of doc.circuit.components) {
    for (const p of c.ports) {
      if (p.role !== 'vent' || p.blocked) continue
      const h = doc.circuit.hoses.find((x) => x.from.portId === p.id || x.to.portId === p.id)
      if (h) out.push({ ...point(c, p), hoseId: h.id })
    }
  }
  return out.sort(byHeight)
}

/** Drain plugs and taps that must be shut before filling. */
export function drainPoints(doc: CircuitDocument): CircuitPoint[] {
  const out: CircuitPoint[] = []
  for (const c of doc.circuit.components) {
    if (c.type === 'drain') out.push(point(c, null))
    for (const p of c.ports) if (p.role === 'drain' && p.blocked) out.push(point(c, p))
  }
  return out.sort(byHeight)
}

export const componentsOfType = <T extends Component['type']>(doc: CircuitDocument, type: T): Array<Extract<Component, { type: T }>> =>
  doc.circuit.components.filter((c): c is Extract<Component, { type: T }> => c.type === type)

/** Hoses joined to a part's ports, e.g. the heater hoses. */
export function hosesOn(doc: CircuitDocument, componentIds: ReadonlySet<string>): string[] {
  const portIds = new Set(doc.circuit.components.filter((c) => componentIds.has(c.id)).flatMap((c) => c.ports.map((p) => p.id)))
  return doc.circuit.hoses.filter((h) => portIds.has(h.from.portId ?? '') || portIds.has(h.to.portId ?? '')).map((h) => h.id)
}
