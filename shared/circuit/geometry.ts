import type { Component, Port } from './component'
import type { Point3 } from './primitives'

/** A port's position in vehicle axes: the part's position plus its offset turned about z by the part's rotation. */
export function portWorldPosition(comp: Pick<Component, 'position' | 'rotationDeg'>, port: Pick<Port, 'offset'>): Point3 {
  const a = (comp.rotationDeg * Math.PI) / 180
  const cos = Math.cos(a)
  const sin = Math.sin(a)
  return {
    x: comp.position.x + port.offset.x * cos - port.offset.y * sin,
    y: comp.position.y + port.offset.x * sin + port.offset.y * cos,
    z: comp.position.z + port.offset.z,
  }
}

export function distanceMm(a: Point3, b: Point3): number {
  return Math.hypot(b.x - a.x, b.y - a.y, b.z - a.z)
}

/** Length of a polyline through the given points, mm. */
export function polylineLengthMm(points: readonly Point3[]): number {
  let total = 0
  for (let i = 1; i < points.length; i++) total += distanceMm(points[i - 1]!, points[i]!)
  return total
}
