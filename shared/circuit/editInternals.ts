// Helpers shared by the pure document edits (edits.ts). Nothing here mutates its input.
import type { Component, Port } from './component'
import type { Circuit, CircuitDocument } from './document'
import { portWorldPosition } from './geometry'
import type { Hose, HoseEnd } from './hose'
import { COORDINATE_LIMIT_MM, type Point3 } from './primitives'

export type EndName = 'from' | 'to'

/** A new document with some circuit fields replaced; the rest is shared with the old one. */
export function withCircuit(doc: CircuitDocument, patch: Partial<Circuit>): CircuitDocument {
  return { ...doc, circuit: { ...doc.circuit, ...patch } }
}

/** Positions are kept to 0.1 mm and inside the coordinate range of the format. */
export function roundMm(v: number): number {
  if (!Number.isFinite(v)) return 0
  const clamped = Math.max(-COORDINATE_LIMIT_MM, Math.min(COORDINATE_LIMIT_MM, v))
  return Math.round(clamped * 10) / 10 || 0
}

export function roundPoint(p: Point3): Point3 {
  return { x: roundMm(p.x), y: roundMm(p.y), z: roundMm(p.z) }
}

export function addPoint(p: Point3, d: Partial<Point3>): Point3 {
  return roundPoint({ x: p.x + (d.x ?? 0), y: p.y + (d.y ?? 0), z: p.z + (d.z ?? 0) })
}

/** Copies an object leaving out keys whose value is undefined (an optional field set to "none"). */
export function withoutUndefined<T extends object>(obj: T): T {
  const out: Record<string, unknown> = {}
  for (const [k, v] of Object.entries(obj)) if (v !== undefined) out[k] = v
  return out as T
}

export interface PortPlace {
  component: Component
  componentIndex: number
  port: Port
}

/** Where each port is: its part and index. */
export function portIndex(circuit: Circuit): Map<string, PortPlace> {
  const map = new Map<string, PortPlace>()
  circuit.components.forEach((component, componentIndex) => {
    for (const port of component.ports) map.set(port.id, { component, componentIndex, port })
  })
  return map
}

/** Which hose end sits on each port. */
export function hoseEndsByPort(circuit: Circuit): Map<string, { hose: Hose; end: EndName }> {
  const map = new Map<string, { hose: Hose; end: EndName }>()
  for (const hose of circuit.hoses) {
    for (const end of ['from', 'to'] as const) {
      const portId = hose[end].portId
      if (portId !== null) map.set(portId, { hose, end })
    }
  }
  return map
}

/** A hose end on no port, lying at a point. */
export function freeEnd(point: Point3, clamp: HoseEnd['clamp']): HoseEnd {
  return { portId: null, point: roundPoint(point), clamp }
}

/**
 * Hose ends on the given ports become free ends where the port was: used when a port goes away,
 * is capped, or its part is deleted. `where` gives each port's world position.
 */
export function freeEndsOn(hoses: Hose[], portIds: ReadonlySet<string>, where: (portId: string) => Point3): Hose[] {
  if (portIds.size === 0) return hoses
  let changed = false
  const next = hoses.map((h) => {
    const fromHit = h.from.portId !== null && portIds.has(h.from.portId)
    const toHit = h.to.portId !== null && portIds.has(h.to.portId)
    if (!fromHit && !toHit) return h
    changed = true
    return {
      ...h,
      from: fromHit ? freeEnd(where(h.from.portId!), h.from.clamp) : h.from,
      to: toHit ? freeEnd(where(h.to.portId!), h.to.clamp) : h.to,
    }
  })
  return changed ? next : hoses
}

/** World position of every port of a circuit, looked up on demand. */
export function portWorldLookup(circuit: Circuit): (portId: string) => Point3 {
  const index = portIndex(circuit)
  return (portId) => {
    const place = index.get(portId)
    return place ? portWorldPosition(place.component, place.port) : { x: 0, y: 0, z: 0 }
  }
}

/** Replaces one part by id (same document when the id is unknown or the part unchanged). */
export function replaceComponent(doc: CircuitDocument, id: string, change: (c: Component) => Component): CircuitDocument {
  const index = doc.circuit.components.findIndex((c) => c.id === id)
  if (index < 0) return doc
  const before = doc.circuit.components[index]!
  const after = change(before)
  if (after === before) return doc
  const components = doc.circuit.components.slice()
  components[index] = after
  return withCircuit(doc, { components })
}

/** Replaces one hose by id (same document when the id is unknown or the hose unchanged). */
export function replaceHose(doc: CircuitDocument, id: string, change: (h: Hose) => Hose): CircuitDocument {
  const index = doc.circuit.hoses.findIndex((h) => h.id === id)
  if (index < 0) return doc
  const before = doc.circuit.hoses[index]!
  const after = change(before)
  if (after === before) return doc
  const hoses = doc.circuit.hoses.slice()
  hoses[index] = after
  return withCircuit(doc, { hoses })
}

/** Turns a vector in vehicle axes into a part's own axes (the inverse of its rotation about z). */
export function toPartAxes(comp: Pick<Component, 'rotationDeg'>, v: Point3): Point3 {
  const a = (-comp.rotationDeg * Math.PI) / 180
  const cos = Math.cos(a)
  const sin = Math.sin(a)
  return { x: v.x * cos - v.y * sin, y: v.x * sin + v.y * cos, z: v.z }
}
