// What is under the pointer on a view, and what a box takes in. Plain geometry on the scene, so the
// canvas layers need no hit graphs of their own (that keeps a 1 000-part drawing quick to redraw).
import { nearestSegment } from './hoseGeometry'
import type { PlanePoint } from './projection'
import type { ViewScene } from './scene'
import type { PlaneRect } from './viewport'

export type Hit =
  | { kind: 'port'; id: string; componentId: string }
  | { kind: 'route-point'; hoseId: string; index: number }
  | { kind: 'hose-end'; hoseId: string; end: 'from' | 'to' }
  | { kind: 'hose'; id: string; segment: number }
  | { kind: 'part'; id: string }

function insideOutline(q: PlanePoint, u: number, v: number, w: number, h: number, rotationDeg: number, pad: number): boolean {
  const a = (-rotationDeg * Math.PI) / 180
  const du = q.u - u
  const dv = q.v - v
  const lu = du * Math.cos(a) - dv * Math.sin(a)
  const lv = du * Math.sin(a) + dv * Math.cos(a)
  return Math.abs(lu) <= w / 2 + pad && Math.abs(lv) <= h / 2 + pad
}

/**
 * The element under a plane point. `tolerance` is in mm on the plane (a few screen px over the
 * scale). Ports come first, then bend points and free hose ends, then hoses, then part bodies.
 */
export function hitTest(scene: ViewScene, q: PlanePoint, tolerance: number): Hit | null {
  // a holder, not a plain variable: TypeScript does not follow assignments made inside the closure
  const best: { hit: Hit | null; d: number } = { hit: null, d: Infinity }
  const consider = (hit: Hit, d: number, limit: number) => {
    if (d <= limit && d < best.d) { best.hit = hit; best.d = d }
  }
  for (const p of scene.ports.values()) consider({ kind: 'port', id: p.id, componentId: p.componentId }, Math.hypot(p.u - q.u, p.v - q.v), tolerance)
  if (best.hit) return best.hit
  for (const h of scene.hoses.values()) {
    const f = h.flat
    for (let i = 2; i < f.length - 2; i += 2) consider({ kind: 'route-point', hoseId: h.id, index: i / 2 - 1 }, Math.hypot(f[i]! - q.u, f[i + 1]! - q.v), tolerance)
    if (h.hose.from.portId === null) consider({ kind: 'hose-end', hoseId: h.id, end: 'from' }, Math.hypot(f[0]! - q.u, f[1]! - q.v), tolerance)
    if (h.hose.to.portId === null) consider({ kind: 'hose-end', hoseId: h.id, end: 'to' }, Math.hypot(f[f.length - 2]! - q.u, f[f.length - 1]! - q.v), tolerance)
  }
  if (best.hit) return best.hit
  for (const h of scene.hoses.values()) {
    const b = h.bounds
    const reach = Math.max(tolerance, h.hose.insideDiameterMm / 2)
    if (q.u < b.minU - reach || q.u > b.maxU + reach || q.v < b.minV - reach || q.v > b.maxV + reach) continue
    const seg = nearestSegment(h.flat, q)
    consider({ kind: 'hose', id: h.id, segment: seg.index }, seg.distance, reach)
  }
  if (best.hit) return best.hit
  let part: { id: string; area: number } | null = null
  for (const p of scene.parts.values()) {
    if (!insideOutline(q, p.u, p.v, p.outline.w, p.outline.h, p.outline.rotation, tolerance / 2)) continue
    const area = p.outline.w * p.outline.h
    if (!part || area < part.area) part = { id: p.id, area } // the smaller part lies on top
  }
  return part ? { kind: 'part', id: part.id } : null
}

/** The nearest port with room for a hose end (not capped, no hose yet) within `tolerance`. */
export function nearestFreePort(scene: ViewScene, q: PlanePoint, tolerance: number, except?: string | null): string | null {
  let best: { id: string; d: number } | null = null
  for (const p of scene.ports.values()) {
    if (p.id === except || p.port.blocked || scene.occupied.has(p.id)) continue
    const d = Math.hypot(p.u - q.u, p.v - q.v)
    if (d <= tolerance && (!best || d < best.d)) best = { id: p.id, d }
  }
  return best?.id ?? null
}

/** Parts whose centre lies in the box, and hoses lying wholly in it. */
export function boxSelect(scene: ViewScene, r: PlaneRect): string[] {
  const inside = (u: number, v: number) => u >= r.minU && u <= r.maxU && v >= r.minV && v <= r.maxV
  const ids: string[] = []
  for (const p of scene.parts.values()) if (inside(p.u, p.v)) ids.push(p.id)
  for (const h of scene.hoses.values()) {
    let all = true
    for (let i = 0; i < h.flat.length && all; i += 2) all = inside(h.flat[i]!, h.flat[i + 1]!)
    if (all) ids.push(h.id)
  }
  return ids
}
