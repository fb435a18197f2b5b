// Pure edits of hoses: drawing one between ports, moving its ends, bending it with route points.
import { hoseFit, NOMINAL_HOSE_BORES_MM } from '../engine/sizes'
import { resolveThresholds } from '../engine/thresholds'
import type { CircuitDocument } from './document'
import {
  freeEnd, hoseEndsByPort, portIndex, replaceHose, roundPoint, withCircuit, withoutUndefined, type EndName,
} from './editInternals'
import { portWorldPosition } from './geometry'
import type { ClampKind, Hose, HoseEnd, HoseMaterial } from './hose'
import { documentIds, newId } from './ids'
import type { Point3 } from './primitives'

/** A hose end to draw to: a port id, or a free point. */
export type EndTarget = string | { point: Point3 }

const MAX_ROUTE_POINTS = 500

/**
 * The bore for a hose between two spigots: the largest common bore that fits both (a hose is
 * stretched a little over a bigger spigot, never clamped down onto a smaller one; fit rule and
 * bores from shared/engine/sizes.ts), else one that fits the first, else the spigot size itself.
 */
export function boreForSpigots(doc: CircuitDocument, spigots: number[]): number {
  const t = resolveThresholds(doc.circuit.settings.thresholds)
  const rule = { looseMm: t.fitLooseMm, stretchPercent: t.fitStretchPercent }
  if (spigots.length === 0) return 15.88 // 5/8 in heater hose, the commonest small bore
  const descending = [...NOMINAL_HOSE_BORES_MM].sort((a, b) => b - a)
  const all = descending.find((b) => spigots.every((s) => hoseFit(b, s, rule) === 'fits'))
  if (all !== undefined) return all
  const first = descending.find((b) => hoseFit(b, spigots[0]!, rule) === 'fits')
  return first ?? Math.max(2, Math.min(200, spigots[0]!))
}

/**
 * Radiator hose from 25 mm bore up, heater hose below (SAE J20 R4 and R3). A fuel circuit gets
 * fuel-injection hose (SAE J30 R9) with EFI clamps, rated for the pressure side and fine on the return
 * (common practice).
 */
export function hoseDefaultsFor(doc: CircuitDocument, boreMm: number): { material: HoseMaterial; wallMm: number; clamp: ClampKind } {
  if (doc.circuit.kind === 'fuel') return { material: 'j30-r9', wallMm: 3.5, clamp: 'efi-band' }
  if (boreMm >= 25) return { material: 'j20-r4-radiator', wallMm: 5, clamp: 'worm-drive' }
  return { material: 'j20-r3-heater', wallMm: boreMm < 10 ? 3.5 : 4, clamp: 'worm-drive' }
}

/**
 * Resolves an end target: a port that exists, is not capped and has no hose yet takes the end;
 * anything else leaves a free end where asked (on an occupied or capped port: at that port).
 */
function endFor(doc: CircuitDocument, target: EndTarget, clamp: ClampKind, ignoreHoseId?: string, otherPortId?: string | null): HoseEnd {
  if (typeof target !== 'string') return freeEnd(target.point, clamp)
  const place = portIndex(doc.circuit).get(target)
  if (!place) return freeEnd({ x: 0, y: 0, z: 0 }, clamp)
  const taken = hoseEndsByPort(doc.circuit).get(target)
  const busy = (taken && taken.hose.id !== ignoreHoseId) || place.port.blocked || otherPortId === target
  return busy ? freeEnd(portWorldPosition(place.component, place.port), clamp) : { portId: target, clamp }
}

export interface HoseOptions {
  insideDiameterMm?: number
  wallMm?: number
  material?: HoseMaterial
  route?: Point3[]
  label?: string
}

/** Draws a hose between two ends, sized from the spigots it joins. */
export function addHose(doc: CircuitDocument, from: EndTarget, to: EndTarget, options: HoseOptions = {}): { doc: CircuitDocument; hoseId: string } {
  const ports = portIndex(doc.circuit)
  const spigots = [from, to].flatMap((t) => (typeof t === 'string' && ports.has(t) ? [ports.get(t)!.port.spigotOdMm] : []))
  const bore = options.insideDiameterMm ?? boreForSpigots(doc, spigots)
  const defaults = hoseDefaultsFor(doc, bore)
  const fromEnd = endFor(doc, from, defaults.clamp)
  const toEnd = endFor(doc, to, defaults.clamp, undefined, fromEnd.portId)
  const hoseId = newId('hose', documentIds(doc))
  const hose: Hose = {
    id: hoseId, from: fromEnd, to: toEnd, insideDiameterMm: bore,
    wallMm: options.wallMm ?? defaults.wallMm, material: options.material ?? defaults.material,
    params: withoutUndefined({ label: options.label, route: (options.route ?? []).slice(0, MAX_ROUTE_POINTS).map(roundPoint) }),
  }
  return { doc: withCircuit(doc, { hoses: [...doc.circuit.hoses, hose] }), hoseId }
}

/** Moves one end of a hose onto a port or to a free point. */
export function setHoseEnd(doc: CircuitDocument, hoseId: string, end: EndName, target: EndTarget): CircuitDocument {
  const hose = doc.circuit.hoses.find((h) => h.id === hoseId)
  if (!hose) return doc
  const other = hose[end === 'from' ? 'to' : 'from'].portId
  const next = endFor(doc, target, hose[end].clamp, hoseId, other)
  return replaceHose(doc, hoseId, (h) => ({ ...h, [end]: next }))
}

function withRoute(h: Hose, route: Point3[]): Hose {
  return { ...h, params: { ...h.params, route } }
}

/** Inserts a bend point before `index` (0 = next to the `from` end; route length = next to `to`). */
export function addRoutePoint(doc: CircuitDocument, hoseId: string, index: number, p: Point3): CircuitDocument {
  return replaceHose(doc, hoseId, (h) => {
    if (h.params.route.length >= MAX_ROUTE_POINTS) return h
    const at = Math.max(0, Math.min(h.params.route.length, Math.round(index)))
    const route = h.params.route.slice()
    route.splice(at, 0, roundPoint(p))
    return withRoute(h, route)
  })
}

/** Moves a bend point; only the coordinates given change. */
export function moveRoutePoint(doc: CircuitDocument, hoseId: string, index: number, p: Partial<Point3>): CircuitDocument {
  return replaceHose(doc, hoseId, (h) => {
    const old = h.params.route[index]
    if (!old) return h
    const route = h.params.route.slice()
    route[index] = roundPoint({ ...old, ...withoutUndefined(p) })
    return withRoute(h, route)
  })
}

export function removeRoutePoint(doc: CircuitDocument, hoseId: string, index: number): CircuitDocument {
  return replaceHose(doc, hoseId, (h) => (h.params.route[index] ? withRoute(h, h.params.route.filter((_, i) => i !== index)) : h))
}

export type HosePatch = Partial<Pick<Hose, 'insideDiameterMm' | 'wallMm' | 'material' | 'measuredLengthMm'>> & {
  /** undefined removes the label */
  label?: string
  route?: Point3[]
  fromClamp?: ClampKind
  toClamp?: ClampKind
}

/** Changes a hose's size, material, measured length, label, route or clamps. A key given as undefined removes an optional field. */
export function updateHose(doc: CircuitDocument, hoseId: string, patch: HosePatch): CircuitDocument {
  return replaceHose(doc, hoseId, (h) => {
    const { label, route, fromClamp, toClamp, ...flat } = patch
    const next: Hose = { ...h, ...flat }
    if ('measuredLengthMm' in patch && patch.measuredLengthMm === undefined) delete next.measuredLengthMm
    const params = { ...h.params }
    if ('label' in patch) {
      if (label === undefined || label === '') delete params.label
      else params.label = label
    }
    if (route) params.route = route.slice(0, MAX_ROUTE_POINTS).map(roundPoint)
    next.params = params
    if (fromClamp) next.from = { ...h.from, clamp: fromClamp }
    if (toClamp) next.to = { ...h.to, clamp: toClamp }
    return next
  })
}

/**
 * Where a new bend point goes on a hose when none is pointed at (keyboard, toolbar): the middle of
 * its longest segment, in vehicle axes, and the route index to insert it at.
 */
export function middleBend(doc: CircuitDocument, hoseId: string): { index: number; point: Point3 } | null {
  const h = doc.circuit.hoses.find((x) => x.id === hoseId)
  if (!h) return null
  const ports = portIndex(doc.circuit)
  const endAt = (e: HoseEnd): Point3 => {
    const place = e.portId !== null ? ports.get(e.portId) : undefined
    return place ? portWorldPosition(place.component, place.port) : e.point ?? { x: 0, y: 0, z: 0 }
  }
  const pts = [endAt(h.from), ...h.params.route, endAt(h.to)]
  let best = 0
  let bestLen = -1
  for (let i = 0; i + 1 < pts.length; i++) {
    const len = Math.hypot(pts[i + 1]!.x - pts[i]!.x, pts[i + 1]!.y - pts[i]!.y, pts[i + 1]!.z - pts[i]!.z)
    if (len > bestLen) { best = i; bestLen = len }
  }
  const a = pts[best]!
  const b = pts[best + 1]!
  return { index: best, point: roundPoint({ x: (a.x + b.x) / 2, y: (a.y + b.y) / 2, z: (a.z + b.z) / 2 }) }
}
