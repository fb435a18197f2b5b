// Pure edits on several elements at once: delete, copy out, paste in, duplicate; circuit settings.
import { z } from 'zod'
import { component, type Component } from './component'
import type { CircuitDocument } from './document'
import { addPoint, freeEnd, freeEndsOn, portWorldLookup, withCircuit, withoutUndefined } from './editInternals'
import { hose, type Hose, type HoseEnd } from './hose'
import { childId, documentIds, newId } from './ids'
import type { Point3 } from './primitives'
import type { CircuitSettings } from './settings'

/**
 * Deletes parts, ports and hoses by id. A hose on a deleted part or port keeps a free end where the
 * port was, so its route is not lost. A thermostat keeps the port its valve shuts.
 */
export function deleteElements(doc: CircuitDocument, ids: readonly string[]): CircuitDocument {
  const gone = new Set(ids)
  if (gone.size === 0) return doc
  const where = portWorldLookup(doc.circuit)
  const freed = new Set<string>()
  let changedParts = false
  const components: Component[] = []
  for (const c of doc.circuit.components) {
    if (gone.has(c.id)) {
      changedParts = true
      for (const p of c.ports) freed.add(p.id)
      continue
    }
    const valved = c.type === 'thermostat' ? c.params.valvedPortId : null
    const ports = c.ports.filter((p) => !gone.has(p.id) || p.id === valved)
    if (ports.length !== c.ports.length) {
      changedParts = true
      for (const p of c.ports) if (!ports.includes(p)) freed.add(p.id)
      components.push({ ...c, ports })
    } else components.push(c)
  }
  const keptHoses = doc.circuit.hoses.filter((h) => !gone.has(h.id))
  const hoses = freeEndsOn(keptHoses, freed, where)
  if (!changedParts && hoses === doc.circuit.hoses) return doc
  return withCircuit(doc, { components: changedParts ? components : doc.circuit.components, hoses })
}

/** Parts and hoses lifted out of a drawing, e.g. for the clipboard. */
export interface ElementBundle {
  components: Component[]
  hoses: Hose[]
}

export const CLIPBOARD_FORMAT = 'hosewright.parts'
/** What the editor puts on the system clipboard (and accepts back from it). */
export const clipboardBundle = z.strictObject({
  format: z.literal(CLIPBOARD_FORMAT),
  components: z.array(component).max(50_000),
  hoses: z.array(hose).max(50_000),
})

/**
 * The listed parts and hoses, plus every hose whose both ends sit on listed parts. An end on a part
 * that is not taken along becomes a free end at that port's position.
 */
export function extractElements(doc: CircuitDocument, ids: readonly string[]): ElementBundle {
  const wanted = new Set(ids)
  const components = doc.circuit.components.filter((c) => wanted.has(c.id))
  const takenPorts = new Set(components.flatMap((c) => c.ports.map((p) => p.id)))
  const onTaken = (e: HoseEnd) => e.portId !== null && takenPorts.has(e.portId)
  const where = portWorldLookup(doc.circuit)
  const hoses = doc.circuit.hoses
    .filter((h) => wanted.has(h.id) || (onTaken(h.from) && onTaken(h.to)))
    .map((h) => {
      const keep = (e: HoseEnd): HoseEnd => (e.portId === null || onTaken(e) ? e : freeEnd(where(e.portId), e.clamp))
      return { ...h, from: keep(h.from), to: keep(h.to) }
    })
  return { components, hoses }
}

/** The local part of a port id ("radiator-2-inlet" on "radiator-2" → "inlet"). */
function localPortName(componentId: string, portId: string): string {
  return portId.startsWith(`${componentId}-`) ? portId.slice(componentId.length + 1) : portId
}

/**
 * Adds a bundle to a drawing, shifted by `offset`, with fresh ids for everything. `idMap` maps each
 * old id (part, port, hose) to its new one. Hose ends on ports outside the bundle become free ends.
 */
export function insertElements(doc: CircuitDocument, bundle: ElementBundle, offset: Partial<Point3> = {}): { doc: CircuitDocument; idMap: Map<string, string> } {
  const ids = documentIds(doc)
  const idMap = new Map<string, string>()
  const components = bundle.components.map((c) => {
    const id = newId(c.type, ids)
    idMap.set(c.id, id)
    const ports = c.ports.map((p) => {
      const portId = childId(id, localPortName(c.id, p.id), ids)
      idMap.set(p.id, portId)
      return { ...p, id: portId }
    })
    const params = c.type === 'thermostat' ? { ...c.params, valvedPortId: idMap.get(c.params.valvedPortId) ?? ports[0]?.id ?? '' } : c.params
    return { ...c, id, position: addPoint(c.position, offset), params, ports } as Component
  })
  const hoses: Hose[] = []
  for (const h of bundle.hoses) {
    const end = (e: HoseEnd): HoseEnd | null => {
      if (e.portId === null) return e.point ? { ...e, point: addPoint(e.point, offset) } : null
      const mapped = idMap.get(e.portId)
      if (mapped) return { portId: mapped, clamp: e.clamp }
      return e.point ? freeEnd(addPoint(e.point, offset), e.clamp) : null
    }
    const from = end(h.from)
    const to = end(h.to)
    if (!from || !to) continue
    const id = newId('hose', ids)
    idMap.set(h.id, id)
    hoses.push({ ...h, id, from, to, params: { ...h.params, route: h.params.route.map((p) => addPoint(p, offset)) } })
  }
  if (components.length === 0 && hoses.length === 0) return { doc, idMap }
  return {
    doc: withCircuit(doc, { components: [...doc.circuit.components, ...components], hoses: [...doc.circuit.hoses, ...hoses] }),
    idMap,
  }
}

/** Copies parts and hoses next to the originals; `idMap` maps old ids to the copies'. */
export function duplicateElements(doc: CircuitDocument, ids: readonly string[], offset: Partial<Point3>) {
  return insertElements(doc, extractElements(doc, ids), offset)
}

/** Changes circuit settings; a key given as undefined removes an optional block (thresholds, coolant). */
export function updateSettings(doc: CircuitDocument, patch: Partial<CircuitSettings>): CircuitDocument {
  const settings = withoutUndefined({ ...doc.circuit.settings, ...patch }) as CircuitSettings
  return withCircuit(doc, { settings })
}

/** Changes the circuit's title or notes (empty notes are removed). */
export function updateCircuitText(doc: CircuitDocument, patch: { title?: string; notes?: string }): CircuitDocument {
  const next = withCircuit(doc, withoutUndefined({ title: patch.title }))
  if (!('notes' in patch)) return next
  const { notes: _old, ...rest } = next.circuit
  return withCircuit({ ...next, circuit: rest }, patch.notes ? { notes: patch.notes } : {})
}
