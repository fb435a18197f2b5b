// Port markers: the shape says the role, so colour is never the only cue.
//   inlet  — filled wedge pointing into the part      outlet — filled wedge pointing out
//   either — open circle                              fill   — open square with a cross
//   vent   — open diamond                             drain  — filled wedge pointing down
// A capped port (plug, closed bleed screw, filler cap) gets a bar across its outer side.
// Sizes are screen px around the port's centre; `outward` is the direction from the part's centre
// to the port on the plane, radians (0 = +u, v down).
import type { PortRole } from '../circuit/component'
import type { Primitive } from './symbols'

function turn(points: number[], angle: number): number[] {
  const c = Math.cos(angle)
  const s = Math.sin(angle)
  const out: number[] = []
  for (let i = 0; i < points.length; i += 2) {
    const x = points[i]!
    const y = points[i + 1]!
    out.push(x * c - y * s, x * s + y * c)
  }
  return out
}

export function portMarker(role: PortRole, outward: number, size: number, blocked: boolean): Primitive[] {
  const r = size / 2
  const wedgeOut = [-r * 0.8, -r, r, 0, -r * 0.8, r]
  let prims: Primitive[]
  switch (role) {
    case 'inlet':
      prims = [{ kind: 'path', points: turn(wedgeOut, outward + Math.PI), closed: true, fill: 'ink' }]
      break
    case 'outlet':
      prims = [{ kind: 'path', points: turn(wedgeOut, outward), closed: true, fill: 'ink' }]
      break
    case 'either':
      prims = [{ kind: 'circle', cx: 0, cy: 0, r: r * 0.85, fill: 'body' }]
      break
    case 'fill':
      prims = [
        { kind: 'rect', x: -r * 0.85, y: -r * 0.85, w: r * 1.7, h: r * 1.7, fill: 'body' },
        { kind: 'path', points: [-r * 0.85, 0, r * 0.85, 0], closed: false, fill: 'none' },
        { kind: 'path', points: [0, -r * 0.85, 0, r * 0.85], closed: false, fill: 'none' },
      ]
      break
    case 'vent':
      prims = [{ kind: 'path', points: [0, -r, r, 0, 0, r, -r, 0], closed: true, fill: 'body' }]
      break
    case 'drain':
      prims = [{ kind: 'path', points: [-r, -r * 0.6, r, -r * 0.6, 0, r], closed: true, fill: 'ink' }]
      break
  }
  if (blocked) prims.push({ kind: 'path', points: turn([r * 1.35, -r * 1.1, r * 1.35, r * 1.1], outward), closed: false, fill: 'none' })
  return prims
}

export const portRoleWords: Record<PortRole, string> = {
  inlet: 'inlet', outlet: 'outlet', either: 'either way', fill: 'filler', vent: 'vent / bleed', drain: 'drain',
}
