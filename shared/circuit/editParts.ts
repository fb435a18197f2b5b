// Pure edits of parts and their ports. Each returns a new document and leaves its input untouched;
// unknown ids give back the same document. Patches must hold values the schema accepts (the forms
// check them with the same zod schemas); the edits keep the cross-references valid.
import { componentFromTemplate, type TemplateBody } from '../schemas/template'
import type { Component, ComponentType, Port } from './component'
import type { CircuitDocument } from './document'
import {
  addPoint, freeEndsOn, portIndex, portWorldLookup, replaceComponent, roundPoint, toPartAxes, withCircuit, withoutUndefined,
} from './editInternals'
import { portWorldPosition } from './geometry'
import { childId, documentIds, newId } from './ids'
import { defaultComponent, PART_KINDS } from './partDefaults'
import type { Point3 } from './primitives'

/** Puts a new part at a point: the type's typical ports and figures, or a workshop template. */
export function placeComponent(
  doc: CircuitDocument, type: ComponentType, at: Point3, template?: TemplateBody,
): { doc: CircuitDocument; componentId: string } {
  const ids = documentIds(doc)
  const partType = template?.type ?? type
  const id = newId(partType, ids)
  const position = roundPoint(at)
  let component: Component
  if (template) {
    component = componentFromTemplate(template, id, position, (local) => childId(id, local, ids))
  } else {
    component = defaultComponent(partType, id, position, ids, doc.circuit.kind)
    const sameType = doc.circuit.components.filter((c) => c.type === partType).length
    if (sameType > 0) component = { ...component, label: `${PART_KINDS[partType].name} ${sameType + 1}` }
  }
  return { doc: withCircuit(doc, { components: [...doc.circuit.components, component] }), componentId: id }
}

/**
 * Moves parts by a distance; only the axes given change. Hoses move with them where it keeps the
 * drawing rigid: the route points of a hose whose both ends move (or that is itself listed), and
 * the free ends of listed hoses.
 */
export function moveComponents(doc: CircuitDocument, ids: readonly string[], delta: Partial<Point3>): CircuitDocument {
  const wanted = new Set(ids)
  if (wanted.size === 0 || (!delta.x && !delta.y && !delta.z)) return doc
  const movedPorts = new Set<string>()
  let anyPart = false
  const components = doc.circuit.components.map((c) => {
    if (!wanted.has(c.id)) return c
    anyPart = true
    for (const p of c.ports) movedPorts.add(p.id)
    return { ...c, position: addPoint(c.position, delta) }
  })
  let anyHose = false
  const hoses = doc.circuit.hoses.map((h) => {
    const listed = wanted.has(h.id)
    const fromMoves = h.from.portId !== null && movedPorts.has(h.from.portId)
    const toMoves = h.to.portId !== null && movedPorts.has(h.to.portId)
    const rigid = listed || (fromMoves && toMoves)
    if (!rigid) return h
    anyHose = true
    const shiftEnd = (end: typeof h.from) => (listed && end.portId === null && end.point ? { ...end, point: addPoint(end.point, delta) } : end)
    return { ...h, from: shiftEnd(h.from), to: shiftEnd(h.to), params: { ...h.params, route: h.params.route.map((p) => addPoint(p, delta)) } }
  })
  if (!anyPart && !anyHose) return doc
  return withCircuit(doc, { components: anyPart ? components : doc.circuit.components, hoses: anyHose ? hoses : doc.circuit.hoses })
}

/** Sets some coordinates of a part's position; the others are kept. */
export function setComponentPosition(doc: CircuitDocument, id: string, position: Partial<Point3>): CircuitDocument {
  return replaceComponent(doc, id, (c) => ({ ...c, position: roundPoint({ ...c.position, ...withoutUndefined(position) }) }))
}

/** Turns a part about the vertical axis by `deg`; the angle is kept in 0…360. */
export function rotateComponent(doc: CircuitDocument, id: string, deg: number): CircuitDocument {
  if (!Number.isFinite(deg)) return doc
  return replaceComponent(doc, id, (c) => {
    const turned = (((c.rotationDeg + deg) % 360) + 360) % 360
    return { ...c, rotationDeg: Math.round(turned * 1000) / 1000 }
  })
}

export type ComponentPatch = Partial<Pick<Component, 'label' | 'position' | 'rotationDeg' | 'volumeL'>> & {
  /** merged into the part's params; a key given as undefined is removed */
  params?: Record<string, unknown>
  /** replaces the port list; hoses on ports that go or get capped are freed where the port was */
  ports?: Port[]
}

export function updateComponent(doc: CircuitDocument, id: string, patch: ComponentPatch): CircuitDocument {
  const before = doc.circuit.components.find((c) => c.id === id)
  if (!before) return doc
  const { params, ports, ...head } = patch
  let after = { ...before, ...withoutUndefined(head) } as Component
  if (head.position) after = { ...after, position: roundPoint(head.position) }
  if (params) after = { ...after, params: withoutUndefined({ ...before.params, ...params }) } as Component
  if (ports) {
    if (after.type === 'thermostat' && !ports.some((p) => p.id === (after.params as { valvedPortId: string }).valvedPortId)) {
      const valved = ports.find((p) => p.role === 'outlet') ?? ports[0]
      if (!valved) return doc // a thermostat needs the port its valve shuts
      after = { ...after, params: { ...after.params, valvedPortId: valved.id } } as Component
    }
    after = { ...after, ports }
  }
  const where = portWorldLookup(doc.circuit)
  const kept = new Map(after.ports.map((p) => [p.id, p]))
  const freed = new Set(before.ports.filter((p) => !kept.has(p.id) || kept.get(p.id)!.blocked).map((p) => p.id))
  const next = replaceComponent(doc, id, () => after)
  return withCircuit(next, { hoses: freeEndsOn(next.circuit.hoses, freed, where) })
}

export type PortPatch = Partial<Omit<Port, 'id'>>

/** Changes a port. Capping a port that has a hose frees that hose end where the port is. */
export function updatePort(doc: CircuitDocument, portId: string, patch: PortPatch): CircuitDocument {
  const place = portIndex(doc.circuit).get(portId)
  if (!place) return doc
  const port: Port = { ...place.port, ...withoutUndefined(patch) }
  if (patch.offset) port.offset = roundPoint(patch.offset)
  const where = portWorldLookup(doc.circuit)
  const next = replaceComponent(doc, place.component.id, (c) => ({ ...c, ports: c.ports.map((p) => (p.id === portId ? port : p)) }))
  return port.blocked ? withCircuit(next, { hoses: freeEndsOn(next.circuit.hoses, new Set([portId]), where) }) : next
}

export type NewPort = Omit<Port, 'id' | 'offset'> & { offset: Point3; key?: string }

/** Adds a port to a part; its id is made from the part id and the port's key or name. */
export function addPort(doc: CircuitDocument, componentId: string, spec: NewPort): { doc: CircuitDocument; portId: string | null } {
  const comp = doc.circuit.components.find((c) => c.id === componentId)
  if (!comp || comp.ports.length >= 64) return { doc, portId: null }
  const portId = childId(componentId, spec.key ?? spec.name, documentIds(doc))
  const port: Port = { id: portId, name: spec.name, role: spec.role, spigotOdMm: spec.spigotOdMm, offset: roundPoint(spec.offset), blocked: spec.blocked }
  return { doc: replaceComponent(doc, componentId, (c) => ({ ...c, ports: [...c.ports, port] })), portId }
}

/** Adds a port at a point in vehicle axes (the offset is worked out in the part's own axes). */
export function addPortAt(doc: CircuitDocument, componentId: string, at: Point3, spec: Omit<NewPort, 'offset'>) {
  const comp = doc.circuit.components.find((c) => c.id === componentId)
  if (!comp) return { doc, portId: null }
  const local = toPartAxes(comp, { x: at.x - comp.position.x, y: at.y - comp.position.y, z: at.z - comp.position.z })
  return addPort(doc, componentId, { ...spec, offset: local })
}

/** Removes a port; a hose on it keeps a free end there. A thermostat's valved port stays. */
export function removePort(doc: CircuitDocument, portId: string): CircuitDocument {
  const place = portIndex(doc.circuit).get(portId)
  if (!place) return doc
  const comp = place.component
  if (comp.type === 'thermostat' && comp.params.valvedPortId === portId) return doc
  const world = portWorldPosition(comp, place.port)
  const next = replaceComponent(doc, comp.id, (c) => ({ ...c, ports: c.ports.filter((p) => p.id !== portId) }))
  return withCircuit(next, { hoses: freeEndsOn(next.circuit.hoses, new Set([portId]), () => world) })
}
