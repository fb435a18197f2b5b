// One-click fixes: the engine's FixAction (shared/engine/report.ts) applied as a pure document edit.
import { nominalBoreFor } from '../engine/sizes'
import { resolveThresholds } from '../engine/thresholds'
import type { FixAction } from '../engine/report'
import type { Component } from './component'
import type { CircuitDocument } from './document'
import { portIndex, portWorldLookup, roundMm, roundPoint, withCircuit } from './editInternals'
import { addHose, hoseDefaultsFor, setHoseEnd, updateHose } from './editHoses'
import { addPortAt, placeComponent, setComponentPosition, updateComponent, updatePort } from './editParts'
import { updateSettings } from './editElements'
import { distanceMm, polylineLengthMm } from './geometry'
import type { Hose } from './hose'
import { documentIds, newId } from './ids'
import type { Point3 } from './primitives'

export interface FixResult {
  doc: CircuitDocument
  /** what to select afterwards, so the fabricator sees what changed */
  selectIds: string[]
}

/** The points of a hose in vehicle axes: its ends and route points in order. */
function hosePoints(doc: CircuitDocument, h: Hose): Point3[] {
  const where = portWorldLookup(doc.circuit)
  const endAt = (e: Hose['from']) => (e.portId !== null ? where(e.portId) : e.point ?? { x: 0, y: 0, z: 0 })
  return [endAt(h.from), ...h.params.route, endAt(h.to)]
}

/** The nearest point of a polyline to `p`: segment index and the point on it. */
function nearestOnPolyline(points: Point3[], p: Point3): { segment: number; at: Point3 } {
  let best = { segment: 0, at: points[0]!, d: Infinity }
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!
    const b = points[i + 1]!
    const ab = { x: b.x - a.x, y: b.y - a.y, z: b.z - a.z }
    const len2 = ab.x ** 2 + ab.y ** 2 + ab.z ** 2
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * ab.x + (p.y - a.y) * ab.y + (p.z - a.z) * ab.z) / len2))
    const at = { x: a.x + ab.x * t, y: a.y + ab.y * t, z: a.z + ab.z * t }
    const d = distanceMm(at, p)
    if (d < best.d) best = { segment: i, at, d }
  }
  return { segment: best.segment, at: best.at }
}

/** Plan angle of a direction, degrees (0 along +x), for turning an inline fitting along its hose. */
function planAngle(a: Point3, b: Point3): number {
  if (Math.hypot(b.x - a.x, b.y - a.y) < 1e-6) return 0
  const deg = (Math.atan2(b.y - a.y, b.x - a.x) * 180) / Math.PI
  return Math.round(((deg % 360) + 360) % 360)
}

/** Runs a part's defaults through a change of spigots and turns it along a hose. */
function fitInline(doc: CircuitDocument, id: string, rotationDeg: number, spigots: Record<string, number>): CircuitDocument {
  const components = doc.circuit.components.map((c) =>
    c.id !== id ? c : ({ ...c, rotationDeg, ports: c.ports.map((p) => (spigots[p.id] !== undefined ? { ...p, spigotOdMm: spigots[p.id]! } : p)) } as Component))
  return withCircuit(doc, { components })
}

/** Splits a measured length in proportion to the drawn lengths of the two pieces. */
function splitMeasured(h: Hose, first: number, second: number): [number | undefined, number | undefined] {
  if (h.measuredLengthMm === undefined) return [undefined, undefined]
  const share = first + second > 0 ? first / (first + second) : 0.5
  const a = Math.max(1, Math.round(h.measuredLengthMm * share))
  return [a, Math.max(1, Math.round(h.measuredLengthMm - a))]
}

/** A bleed tee cut into a hose at its high point; the hose becomes two, joined by the tee. */
function addBleedValve(doc: CircuitDocument, hoseId: string, at: Point3): FixResult {
  const h = doc.circuit.hoses.find((x) => x.id === hoseId)
  if (!h) return { doc, selectIds: [] }
  const pts = hosePoints(doc, h)
  const split = nearestOnPolyline(pts, at)
  const routeIndex = split.segment // route points before the split: route[0 .. segment-1]
  let before = h.params.route.slice(0, routeIndex)
  let after = h.params.route.slice(routeIndex)
  const exact = after[0] && distanceMm(after[0], split.at) < 1 ? after[0] : null
  if (exact) after = after.slice(1)
  const prevExact = before.length > 0 && distanceMm(before[before.length - 1]!, split.at) < 1
  if (prevExact) before = before.slice(0, -1)
  const placed = placeComponent(doc, 'bleed-valve', roundPoint(split.at))
  const bleed = placed.doc.circuit.components.find((c) => c.id === placed.componentId)!
  const [runA, runB] = bleed.ports
  const bore = h.insideDiameterMm
  let next = fitInline(placed.doc, bleed.id, planAngle(pts[split.segment]!, pts[split.segment + 1]!), { [runA!.id]: bore, [runB!.id]: bore })
  const firstLen = polylineLengthMm([pts[0]!, ...before, split.at])
  const secondLen = polylineLengthMm([split.at, ...after, pts[pts.length - 1]!])
  const [m1, m2] = splitMeasured(h, firstLen, secondLen)
  const secondId = newId('hose', documentIds(next))
  const second: Hose = {
    ...h, id: secondId, from: { portId: runB!.id, clamp: h.to.clamp }, to: h.to,
    params: { ...(h.params.label ? { label: `${h.params.label} (after bleed tee)`.slice(0, 120) } : {}), route: after },
  }
  if (m2 === undefined) delete second.measuredLengthMm
  else second.measuredLengthMm = m2
  const first: Hose = { ...h, to: { portId: runA!.id, clamp: h.from.clamp }, params: { ...h.params, route: before } }
  if (m1 !== undefined) first.measuredLengthMm = m1
  next = withCircuit(next, { hoses: [...next.circuit.hoses.map((x) => (x.id === hoseId ? first : x)), second] })
  return { doc: next, selectIds: [bleed.id] }
}

/** A reducer at a hose end: the hose goes onto its large end, a short stub of the spigot's size onto the port. */
function addReducer(doc: CircuitDocument, action: Extract<FixAction, { type: 'add-reducer' }>): FixResult {
  const h = doc.circuit.hoses.find((x) => x.id === action.hoseId)
  const portId = h?.[action.end].portId
  const place = portId ? portIndex(doc.circuit).get(portId) : undefined
  if (!h || !portId || !place) return { doc, selectIds: [] }
  const t = resolveThresholds(doc.circuit.settings.thresholds)
  const rule = { looseMm: t.fitLooseMm, stretchPercent: t.fitStretchPercent }
  const stubBore = nominalBoreFor(action.spigotOdMm, rule) ?? Math.max(2, Math.min(200, action.spigotOdMm))
  const pts = hosePoints(doc, h)
  const portAt = action.end === 'from' ? pts[0]! : pts[pts.length - 1]!
  const toward = action.end === 'from' ? pts[1]! : pts[pts.length - 2]!
  const span = distanceMm(portAt, toward)
  const k = span > 0 ? Math.min(1, 80 / span) : 0
  const at = roundPoint({ x: portAt.x + (toward.x - portAt.x) * k, y: portAt.y + (toward.y - portAt.y) * k, z: portAt.z + (toward.z - portAt.z) * k })
  const placed = placeComponent(doc, 'reducer', at)
  const reducer = placed.doc.circuit.components.find((c) => c.id === placed.componentId)!
  const [large, small] = reducer.ports
  // the hose side takes the hose's own bore as its spigot, the port side the stub's bore: both fit exactly
  let next = fitInline(placed.doc, reducer.id, planAngle(toward, portAt), { [large!.id]: h.insideDiameterMm, [small!.id]: stubBore })
  next = setHoseEnd(next, h.id, action.end, large!.id)
  const defaults = hoseDefaultsFor(next, stubBore)
  const stubId = newId('hose', documentIds(next))
  const stub: Hose = {
    id: stubId, from: { portId: small!.id, clamp: h[action.end].clamp }, to: { portId, clamp: h[action.end].clamp },
    insideDiameterMm: stubBore, wallMm: defaults.wallMm, material: h.material === 'hard-line' ? defaults.material : h.material,
    params: { label: 'Reducer stub', route: [] },
  }
  next = withCircuit(next, { hoses: [...next.circuit.hoses, stub] })
  return { doc: next, selectIds: [reducer.id] }
}

function coolantPatch(doc: CircuitDocument, change: (c: NonNullable<CircuitDocument['circuit']['settings']['coolant']>) => typeof c): CircuitDocument {
  const coolant = doc.circuit.settings.coolant
  return coolant ? updateSettings(doc, { coolant: change(coolant) }) : doc
}

/** A hose between two open ports, sized and classed as a freshly drawn one; nothing when either is taken or unknown. */
function joinPorts(doc: CircuitDocument, fromPortId: string, toPortId: string, label?: string): FixResult {
  const ports = portIndex(doc.circuit)
  const a = ports.get(fromPortId)
  const b = ports.get(toPortId)
  const taken = new Set(doc.circuit.hoses.flatMap((h) => [h.from.portId, h.to.portId]))
  if (!a || !b || fromPortId === toPortId || a.port.blocked || b.port.blocked || taken.has(fromPortId) || taken.has(toPortId)) return { doc, selectIds: [] }
  const added = addHose(doc, fromPortId, toPortId, label ? { label } : {})
  return { doc: added.doc, selectIds: [added.hoseId] }
}

/** Applies a fix the engine offered. Unknown ids leave the document as it is. */
export function applyFix(doc: CircuitDocument, action: FixAction): FixResult {
  switch (action.type) {
    case 'block-port':
      return { doc: updatePort(doc, action.portId, { blocked: true }), selectIds: [action.portId] }
    case 'join-hose-end':
      return { doc: setHoseEnd(doc, action.hoseId, action.end, action.portId), selectIds: [action.hoseId] }
    case 'add-bleed-valve':
      return addBleedValve(doc, action.hoseId, action.at)
    case 'add-vent-port': {
      const added = addPortAt(doc, action.componentId, action.at, { key: 'bleed', name: 'bleed screw', role: 'vent', spigotOdMm: 8, blocked: true })
      return { doc: added.doc, selectIds: added.portId ? [added.portId] : [] }
    }
    case 'add-reducer':
      return addReducer(doc, action)
    case 'set-hose-bore':
      return { doc: updateHose(doc, action.hoseId, { insideDiameterMm: action.insideDiameterMm }), selectIds: [action.hoseId] }
    case 'raise-component':
      return { doc: setComponentPosition(doc, action.componentId, { z: roundMm(action.z) }), selectIds: [action.componentId] }
    case 'set-cap-rating':
      return { doc: coolantPatch(doc, (c) => ({ ...c, capRatingKpa: action.capRatingKpa })), selectIds: [] }
    case 'set-coolant-percent':
      return { doc: coolantPatch(doc, (c) => ({ ...c, mix: { ...c.mix, percentByVolume: action.percentByVolume } })), selectIds: [] }
    case 'join-ports':
      return joinPorts(doc, action.fromPortId, action.toPortId, action.label)
    case 'set-regulator-reference': {
      const reg = doc.circuit.components.find((c) => c.id === action.componentId)
      if (reg?.type !== 'fuel-regulator') return { doc, selectIds: [] }
      return { doc: updateComponent(doc, reg.id, { params: { reference: action.reference } }), selectIds: [reg.id] }
    }
    case 'set-hose-material':
      return { doc: updateHose(doc, action.hoseId, { material: action.material }), selectIds: [action.hoseId] }
  }
}
