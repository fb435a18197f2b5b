// Symbols of the fuel parts, in the same plain geometry as shared/drawing/symbols.ts. Loosely after
// the fluid-power conventions where they exist (a filter is a diamond with its element across it, a
// pump a circle with a triangle); the rest are our own. Coordinates are mm on the view plane, centred
// on the part, v down; w × h is the part's outline on that view.
import type { FuelComponentType } from '../circuit/fuelParts'
import type { Fill, Primitive } from './symbols'

const rect = (x: number, y: number, w: number, h: number, fill: Fill = 'body', r = 0): Primitive => ({ kind: 'rect', x, y, w, h, r, fill })
const path = (points: number[], closed = false, fill: Fill = 'none', dash = false): Primitive => ({ kind: 'path', points, closed, fill, dash })
const circle = (cx: number, cy: number, r: number, fill: Fill = 'body'): Primitive => ({ kind: 'circle', cx, cy, r, fill })

/** The pump mark: a circle with a triangle pointing along +u (the outlet side). */
function pumpMark(cx: number, cy: number, r: number): Primitive[] {
  return [circle(cx, cy, r), path([cx - r * 0.45, cy - r * 0.55, cx + r * 0.65, cy, cx - r * 0.45, cy + r * 0.55], true, 'ink')]
}

export const FUEL_SYMBOL_BUILDERS: Record<FuelComponentType, (w: number, h: number) => Primitive[]> = {
  'fuel-tank': (w, h) => {
    const s = Math.min(w, h)
    return [
      rect(-w / 2, -h / 2, w, h, 'body', s * 0.18),
      // the level inside, and the sender's flange on the top
      path([-w * 0.44, -h * 0.02, w * 0.44, -h * 0.02], false, 'none', true),
      rect(w * 0.12, -h / 2 - s * 0.06, w * 0.16, s * 0.12, 'accent', s * 0.03),
    ]
  },
  'in-tank-pump': (w, h) => {
    const r = Math.min(w, h) * 0.42
    // the hanger tube from the top plate down to the pump, and the sock below it
    return [
      rect(-w * 0.12, -h / 2, w * 0.24, h * 0.45, 'body'),
      ...pumpMark(0, h * 0.12, r),
      path([-r * 0.7, h / 2 - r * 0.2, r * 0.7, h / 2 - r * 0.2], false, 'none', true),
    ]
  },
  'inline-pump': (w, h) => {
    const r = Math.min(w, h) * 0.45
    return [rect(-w / 2, -h * 0.3, w, h * 0.6, 'body', h * 0.2), ...pumpMark(0, 0, r)]
  },
  'fuel-filter': (w, h) => [
    path([-w / 2, 0, 0, -h / 2, w / 2, 0, 0, h / 2], true, 'body'),
    path([0, -h * 0.42, 0, h * 0.42], false, 'none', true),
  ],
  'fuel-regulator': (w, h) => {
    const s = Math.min(w, h)
    const spring: number[] = []
    for (let i = 0; i <= 6; i++) spring.push((i % 2 ? 1 : -1) * w * 0.18, -h / 2 + (i * h * 0.3) / 6)
    return [
      rect(-w / 2, -h * 0.15, w, h * 0.65, 'body', s * 0.1),
      path(spring),
      // the adjusting arrow across the body
      path([-w * 0.35, h * 0.4, w * 0.35, -h * 0.05]),
      path([w * 0.18, -h * 0.05, w * 0.35, -h * 0.05, w * 0.35, h * 0.1]),
    ]
  },
  'fuel-rail': (w, h) => {
    const cups = [0, 1, 2, 3].map((i) => circle(-w * 0.36 + (i * w * 0.72) / 3, 0, Math.min(w, h) * 0.22, 'none'))
    return [rect(-w / 2, -h / 2, w, h, 'body', h * 0.3), ...cups]
  },
  injector: (w, h) => [
    rect(-w / 2, -h / 2, w, h * 0.6, 'body', w * 0.2),
    path([-w * 0.3, h * 0.1, w * 0.3, h * 0.1, w * 0.1, h * 0.38, -w * 0.1, h * 0.38], true, 'accent'),
    // the spray below the tip
    path([0, h * 0.4, -w * 0.45, h / 2], false, 'none', true),
    path([0, h * 0.4, w * 0.45, h / 2], false, 'none', true),
  ],
  'bulkhead-fitting': (w, h) => [
    rect(-w * 0.22, -h / 2, w * 0.44, h, 'body'),
    rect(-w / 2, -h * 0.1, w, h * 0.2, 'accent'),
  ],
}
