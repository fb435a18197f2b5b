// Geometry of a hose drawn on a view: its polyline on the plane, whether it crosses itself there,
// where along it a point or a label sits, and which segment a pointer is nearest to.
import { distanceMm } from '../circuit/geometry'
import type { Point3 } from '../circuit/primitives'
import { project, type PlanePoint, type ViewName } from './projection'

/** The hose's points (end, route…, end) on the view plane as a flat u, v list. */
export function planePolyline(view: ViewName, points: readonly Point3[]): number[] {
  const out: number[] = []
  for (const p of points) {
    const q = project(view, p)
    out.push(q.u, q.v)
  }
  return out
}

function segmentsCross(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): boolean {
  const d1 = (dx - cx) * (ay - cy) - (dy - cy) * (ax - cx)
  const d2 = (dx - cx) * (by - cy) - (dy - cy) * (bx - cx)
  const d3 = (bx - ax) * (cy - ay) - (by - ay) * (cx - ax)
  const d4 = (bx - ax) * (dy - ay) - (by - ay) * (dx - ax)
  return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))
}

/**
 * True when two segments of the polyline that are not neighbours cross properly. Touching and
 * overlapping do not count: a hose drawn straight up and down again in a view is not a crossing.
 */
export function crossesItself(flat: readonly number[]): boolean {
  const n = flat.length / 2 - 1
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (segmentsCross(flat[2 * i]!, flat[2 * i + 1]!, flat[2 * i + 2]!, flat[2 * i + 3]!, flat[2 * j]!, flat[2 * j + 1]!, flat[2 * j + 2]!, flat[2 * j + 3]!)) return true
    }
  }
  return false
}

/** A measured length shorter than the straight line between the ends cannot be: the tape or the drawing is wrong. */
export function measuredTooShort(measuredLengthMm: number | undefined, ends: readonly [Point3, Point3]): boolean {
  return measuredLengthMm !== undefined && measuredLengthMm + 0.5 < distanceMm(ends[0], ends[1])
}

export function planeLength(flat: readonly number[]): number {
  let total = 0
  for (let i = 2; i < flat.length; i += 2) total += Math.hypot(flat[i]! - flat[i - 2]!, flat[i + 1]! - flat[i - 1]!)
  return total
}

/** The point at a fraction of the polyline's length on the plane, with the direction there (radians). */
export function pointAlong(flat: readonly number[], fraction: number): { u: number; v: number; angle: number } | null {
  const total = planeLength(flat)
  if (total <= 0 || flat.length < 4) return null
  let left = Math.max(0, Math.min(1, fraction)) * total
  for (let i = 2; i < flat.length; i += 2) {
    const du = flat[i]! - flat[i - 2]!
    const dv = flat[i + 1]! - flat[i - 1]!
    const len = Math.hypot(du, dv)
    if (len > 0 && (left <= len || i === flat.length - 2)) {
      const t = Math.min(1, left / len)
      return { u: flat[i - 2]! + du * t, v: flat[i - 1]! + dv * t, angle: Math.atan2(dv, du) }
    }
    left -= len
  }
  return null
}

/** The nearest segment to a plane point: index (0 = from the first point), position along it (0–1) and distance. */
export function nearestSegment(flat: readonly number[], q: PlanePoint): { index: number; t: number; distance: number } {
  let best = { index: 0, t: 0, distance: Infinity }
  for (let i = 0; i + 3 < flat.length; i += 2) {
    const au = flat[i]!
    const av = flat[i + 1]!
    const du = flat[i + 2]! - au
    const dv = flat[i + 3]! - av
    const len2 = du * du + dv * dv
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((q.u - au) * du + (q.v - av) * dv) / len2))
    const d = Math.hypot(au + du * t - q.u, av + dv * t - q.v)
    if (d < best.distance) best = { index: i / 2, t, distance: d }
  }
  return best
}

/**
 * Where a new bend point goes when the fabricator grabs a hose at a plane point: the route index to
 * insert at and the 3-D point (the view's two axes from the pointer, the hidden axis interpolated
 * along the segment).
 */
export function routeInsertion(view: ViewName, points: readonly Point3[], q: PlanePoint): { index: number; point: Point3 } {
  const seg = nearestSegment(planePolyline(view, points), q)
  const a = points[seg.index]!
  const b = points[seg.index + 1] ?? a
  const lerp = (x: number, y: number) => x + (y - x) * seg.t
  const point = view === 'side'
    ? { x: q.u, y: lerp(a.y, b.y), z: -q.v }
    : { x: q.u, y: -q.v, z: lerp(a.z, b.z) }
  return { index: seg.index, point }
}
