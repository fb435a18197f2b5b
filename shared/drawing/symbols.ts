// Hosewright's part symbols as plain geometry, so the canvas and the SVG export draw the same thing.
// Where ISO 10628-2 has a convention it is followed loosely (pump: circle with a triangle; heat
// exchanger: a box with a zig-zag; valve: two triangles point to point); the rest are our own.
// Coordinates are mm on the view plane, centred on the part, v down; outlines are sized to the
// part's typical envelope (PART_KINDS), so a drawing is to scale.
import type { Component, ComponentType } from '../circuit/component'
import { PART_KINDS } from '../circuit/partDefaults'
import { FUEL_SYMBOL_BUILDERS } from './fuelSymbols'
import type { ViewName } from './projection'

export type Fill = 'body' | 'ink' | 'none' | 'accent'

export type Primitive =
  | { kind: 'rect'; x: number; y: number; w: number; h: number; r?: number; fill: Fill }
  | { kind: 'circle'; cx: number; cy: number; r: number; fill: Fill }
  | { kind: 'path'; points: number[]; closed: boolean; fill: Fill; dash?: boolean }

/** The part's outline on a view: width and height on the plane and the turn on screen (degrees, clockwise). */
export interface Outline {
  w: number
  h: number
  rotation: number
}

export function partOutline(comp: Pick<Component, 'type' | 'rotationDeg'>, view: ViewName): Outline {
  const e = PART_KINDS[comp.type].envelopeMm
  if (view === 'top') return { w: e.x, h: e.y, rotation: -comp.rotationDeg }
  // seen from the side, a part turned about z shows the projection of its plan box
  const a = (comp.rotationDeg * Math.PI) / 180
  return { w: Math.abs(e.x * Math.cos(a)) + Math.abs(e.y * Math.sin(a)), h: e.z, rotation: 0 }
}

const rect = (x: number, y: number, w: number, h: number, fill: Fill = 'body', r = 0): Primitive => ({ kind: 'rect', x, y, w, h, r, fill })
const path = (points: number[], closed = false, fill: Fill = 'none', dash = false): Primitive => ({ kind: 'path', points, closed, fill, dash })
const circle = (cx: number, cy: number, r: number, fill: Fill = 'body'): Primitive => ({ kind: 'circle', cx, cy, r, fill })

/** A zig-zag across the longer side of a w × h box: the heat-exchanger mark. */
function zigzag(w: number, h: number, teeth = 5): number[] {
  const pts: number[] = []
  const along = w >= h
  const len = (along ? w : h) * 0.8
  const amp = (along ? h : w) * 0.22
  for (let i = 0; i <= teeth * 2; i++) {
    const s = -len / 2 + (len * i) / (teeth * 2)
    const off = i === 0 || i === teeth * 2 ? 0 : i % 2 ? -amp : amp
    pts.push(...(along ? [s, off] : [off, s]))
  }
  return pts
}

/** Two triangles meeting at the centre, across the longer side. */
function bowTie(w: number, h: number): Primitive[] {
  const hw = w / 2
  const hh = h * 0.3
  return [path([-hw, -hh, 0, 0, -hw, hh], true, 'body'), path([hw, -hh, 0, 0, hw, hh], true, 'body')]
}

type SymbolBuilder = (w: number, h: number) => Primitive[]

const builders: Record<ComponentType, SymbolBuilder> = {
  engine: (w, h) => {
    const s = Math.min(w, h)
    const head = h * 0.28
    const bores = [0, 1, 2, 3].map((i) => circle(-w * 0.3 + (i * w * 0.6) / 3, h * 0.12, s * 0.09, 'none'))
    return [rect(-w / 2, -h / 2, w, h, 'body', s * 0.06), rect(-w / 2, -h / 2, w, head, 'accent', s * 0.06), ...bores]
  },
  'water-pump': (w, h) => {
    const r = Math.min(w, h) / 2
    return [circle(0, 0, r), path([-r * 0.45, -r * 0.55, r * 0.65, 0, -r * 0.45, r * 0.55], true, 'ink')]
  },
  radiator: (w, h) => {
    const tank = Math.min(w, h) * 0.14
    const tanks = w >= h
      ? [rect(-w / 2, -h / 2, tank, h, 'accent'), rect(w / 2 - tank, -h / 2, tank, h, 'accent')]
      : [rect(-w / 2, -h / 2, w, tank, 'accent'), rect(-w / 2, h / 2 - tank, w, tank, 'accent')]
    return [rect(-w / 2, -h / 2, w, h), ...tanks, path(zigzag(w, h, 6))]
  },
  'heater-core': (w, h) => [rect(-w / 2, -h / 2, w, h, 'body', Math.min(w, h) * 0.08), path(zigzag(w, h, 4)), path([-w / 2, h / 2, w / 2, -h / 2])],
  thermostat: (w, h) => [
    ...bowTie(w, h),
    path([0, 0, 0, -h * 0.36]),
    circle(0, -h * 0.4, Math.min(w, h) * 0.1, 'ink'),
  ],
  'thermostat-housing': (w, h) => [rect(-w / 2, -h / 2, w, h, 'body', Math.min(w, h) * 0.2), circle(0, 0, Math.min(w, h) * 0.22, 'none')],
  'heater-valve': (w, h) => [...bowTie(w, h), path([0, 0, 0, -h * 0.45]), path([-w * 0.25, -h * 0.45, w * 0.25, -h * 0.45])],
  'pressure-cap': (w, h) => [
    path([-w / 2, h * 0.3, w / 2, h * 0.3]),
    rect(-w * 0.2, -h * 0.3, w * 0.4, h * 0.6),
    rect(-w * 0.38, -h / 2, w * 0.76, h * 0.2, 'accent', h * 0.04),
    path([-w * 0.1, -h * 0.22, w * 0.1, -h * 0.12, -w * 0.1, -h * 0.02, w * 0.1, h * 0.08]),
  ],
  'expansion-tank': (w, h) => [rect(-w / 2, -h / 2, w, h, 'body', Math.min(w, h) * 0.25), path([-w * 0.42, -h * 0.05, w * 0.42, -h * 0.05], false, 'none', true)],
  'overflow-bottle': (w, h) => [
    path([-w / 2, -h * 0.3, -w / 2, h / 2, w / 2, h / 2, w / 2, -h * 0.3, w * 0.15, -h * 0.3, w * 0.15, -h / 2, -w * 0.15, -h / 2, -w * 0.15, -h * 0.3], true, 'body'),
    path([-w * 0.42, h * 0.15, w * 0.42, h * 0.15], false, 'none', true),
  ],
  'deaeration-pot': (w, h) => [
    path([-w / 2, -h / 2, w / 2, -h / 2, w / 2, h * 0.15, w * 0.12, h / 2, -w * 0.12, h / 2, -w / 2, h * 0.15], true, 'body'),
    path([-w * 0.25, -h * 0.15, 0, -h * 0.28, w * 0.25, -h * 0.15, 0, -h * 0.02, -w * 0.18, -h * 0.12]),
  ],
  'bleed-valve': (w, h) => [
    rect(-w / 2, -h * 0.12, w, h * 0.24),
    path([0, -h * 0.12, 0, -h * 0.48]),
    path([-w * 0.14, -h * 0.32, 0, -h * 0.5, w * 0.14, -h * 0.32]),
  ],
  tee: (w, h) => [rect(-w / 2, -h * 0.18, w, h * 0.36), rect(-w * 0.14, -h / 2, w * 0.28, h * 0.5)],
  reducer: (w, h) => [path([-w / 2, -h / 2, w / 2, -h * 0.28, w / 2, h * 0.28, -w / 2, h / 2], true, 'body')],
  'blanking-plug': (w, h) => [rect(-w / 2, -h / 2, w, h, 'ink', Math.min(w, h) * 0.3)],
  drain: (w, h) => [rect(-w / 2, -h * 0.12, w, h * 0.24), path([-w * 0.18, h * 0.12, w * 0.18, h * 0.12, 0, h * 0.48], true, 'ink')],
  generic: (w, h) => [rect(-w / 2, -h / 2, w, h, 'body', Math.min(w, h) * 0.12), circle(0, 0, Math.min(w, h) * 0.08, 'ink')],
  ...FUEL_SYMBOL_BUILDERS,
}

/** The primitives of a part's symbol in an outline of w × h mm, centred on (0, 0), before turning. */
export function symbolPrimitives(type: ComponentType, w: number, h: number): Primitive[] {
  return builders[type](w, h)
}

/** Every point of a primitive list, for bounds (flat u, v pairs). */
export function primitivePoints(prims: readonly Primitive[]): number[] {
  const out: number[] = []
  for (const p of prims) {
    if (p.kind === 'rect') out.push(p.x, p.y, p.x + p.w, p.y + p.h)
    else if (p.kind === 'circle') out.push(p.cx - p.r, p.cy - p.r, p.cx + p.r, p.cy + p.r)
    else out.push(...p.points)
  }
  return out
}

/**
 * A port outside its part's outline is joined to it by a short stub: from the nearest point of the
 * outline to the port, in plane coordinates. Null when the port sits on or in the outline.
 */
export function outlineStub(
  centre: { u: number; v: number }, outline: Outline, port: { u: number; v: number },
): [number, number, number, number] | null {
  const a = (outline.rotation * Math.PI) / 180
  const cos = Math.cos(a)
  const sin = Math.sin(a)
  const du = port.u - centre.u
  const dv = port.v - centre.v
  // into the outline's own axes (undo the screen turn), clamp to the box, and back
  const lu = du * cos + dv * sin
  const lv = -du * sin + dv * cos
  const cu = Math.max(-outline.w / 2, Math.min(outline.w / 2, lu))
  const cv = Math.max(-outline.h / 2, Math.min(outline.h / 2, lv))
  if (Math.hypot(lu - cu, lv - cv) < 1) return null
  return [centre.u + cu * cos - cv * sin, centre.v + cu * sin + cv * cos, port.u, port.v]
}
