// The geometry of a whole drawing on one view, kept up to date incrementally: documents are
// immutable and share unchanged parts, so a part whose object is the same as last time has the same
// geometry, and a hose needs redoing only when it or a part at one of its ends changed. This is what
// keeps a drag of one part in a 1 000-part drawing from re-laying out everything.
import type { Component, Port } from '../circuit/component'
import type { CircuitDocument } from '../circuit/document'
import { portWorldPosition } from '../circuit/geometry'
import type { Hose } from '../circuit/hose'
import type { Point3 } from '../circuit/primitives'
import { crossesItself, measuredTooShort, planePolyline } from './hoseGeometry'
import { project, type ViewName } from './projection'
import { partOutline, type Outline } from './symbols'
import { unionRect, type PlaneRect } from './viewport'

export interface PortGeom {
  id: string
  componentId: string
  port: Port
  u: number
  v: number
  /** direction from the part's centre to the port on the plane, radians */
  outward: number
  world: Point3
}

export interface PartGeom {
  id: string
  comp: Component
  u: number
  v: number
  outline: Outline
  ports: PortGeom[]
  bounds: PlaneRect
}

export interface HoseGeom {
  id: string
  hose: Hose
  /** ends and route points in vehicle axes */
  world: Point3[]
  /** the same on the plane, flat u, v pairs */
  flat: number[]
  bounds: PlaneRect
  crosses: boolean
  tooShort: boolean
}

export interface SceneChanges {
  parts: Set<string>
  hoses: Set<string>
  removed: Set<string>
}

function partGeometry(view: ViewName, comp: Component): PartGeom {
  const c = project(view, comp.position)
  const outline = partOutline(comp, view)
  const rad = (outline.rotation * Math.PI) / 180
  const cos = Math.abs(Math.cos(rad))
  const sin = Math.abs(Math.sin(rad))
  const hw = (outline.w * cos + outline.h * sin) / 2
  const hh = (outline.w * sin + outline.h * cos) / 2
  let bounds: PlaneRect = { minU: c.u - hw, minV: c.v - hh, maxU: c.u + hw, maxV: c.v + hh }
  const ports = comp.ports.map((port) => {
    const world = portWorldPosition(comp, port)
    const q = project(view, world)
    bounds = unionRect(bounds, { minU: q.u, minV: q.v, maxU: q.u, maxV: q.v })
    const du = q.u - c.u
    const dv = q.v - c.v
    return { id: port.id, componentId: comp.id, port, u: q.u, v: q.v, outward: Math.hypot(du, dv) < 1e-6 ? -Math.PI / 2 : Math.atan2(dv, du), world }
  })
  return { id: comp.id, comp, u: c.u, v: c.v, outline, ports, bounds }
}

interface HoseEntry {
  geom: HoseGeom
  fromComp: Component | undefined
  toComp: Component | undefined
}

export class ViewScene {
  readonly parts = new Map<string, PartGeom>()
  readonly hoses = new Map<string, HoseGeom>()
  readonly ports = new Map<string, PortGeom>()
  /** ports that have a hose end on them */
  readonly occupied = new Set<string>()
  /** hoses whose ends sit on each part */
  readonly hosesByPart = new Map<string, Set<string>>()
  private hoseEntries = new Map<string, HoseEntry>()
  private portOwner = new Map<string, Component>()
  private lastComponents: readonly Component[] | null = null
  private lastHoses: readonly Hose[] | null = null
  /** how often the parts and the hoses were laid out from scratch (for benchmarks) */
  readonly rebuilds = { parts: 0, hoses: 0 }

  constructor(readonly view: ViewName) {}

  /** Brings the geometry up to `doc`; returns what changed (ids), for the renderer to redraw only that. */
  update(doc: CircuitDocument): SceneChanges {
    const changes: SceneChanges = { parts: new Set(), hoses: new Set(), removed: new Set() }
    const { components, hoses } = doc.circuit
    const partsChanged = components !== this.lastComponents
    const hosesChanged = hoses !== this.lastHoses
    if (partsChanged) {
      // the usual change (a drag, an edit): the same parts in the same order, a few of them new objects
      if (!this.updatePartsInPlace(components, changes)) this.rebuildParts(components, changes)
      this.lastComponents = components
    }
    if (hosesChanged) this.rebuildHoses(hoses, changes)
    else if (changes.parts.size > 0) {
      // only the hoses at the changed parts can have moved
      for (const partId of changes.parts) {
        for (const hoseId of this.hosesByPart.get(partId) ?? []) this.refreshHose(this.hoseEntries.get(hoseId)!.geom.hose, changes)
      }
    }
    this.lastHoses = hoses
    return changes
  }

  private indexPorts(geom: PartGeom) {
    for (const p of geom.ports) {
      this.portOwner.set(p.id, geom.comp)
      this.ports.set(p.id, p)
    }
  }

  private updatePartsInPlace(components: readonly Component[], changes: SceneChanges): boolean {
    const last = this.lastComponents
    if (!last || last.length !== components.length) return false
    for (let i = 0; i < components.length; i++) if (components[i]!.id !== last[i]!.id) return false
    for (let i = 0; i < components.length; i++) {
      const comp = components[i]!
      if (comp === last[i]) continue
      const old = this.parts.get(comp.id)
      for (const p of old?.ports ?? []) { this.ports.delete(p.id); this.portOwner.delete(p.id) }
      const geom = partGeometry(this.view, comp)
      this.parts.set(comp.id, geom)
      this.indexPorts(geom)
      changes.parts.add(comp.id)
    }
    return true
  }

  private rebuildParts(components: readonly Component[], changes: SceneChanges) {
    this.rebuilds.parts++
    const seen = new Set<string>()
    this.portOwner.clear()
    this.ports.clear()
    for (const comp of components) {
      seen.add(comp.id)
      let geom = this.parts.get(comp.id)
      if (!geom || geom.comp !== comp) {
        geom = partGeometry(this.view, comp)
        this.parts.set(comp.id, geom)
        changes.parts.add(comp.id)
      }
      this.indexPorts(geom)
    }
    for (const id of [...this.parts.keys()]) if (!seen.has(id)) { this.parts.delete(id); changes.removed.add(id) }
  }

  /** Redoes a hose's geometry when it or a part at one of its ends is a new object. */
  private refreshHose(hose: Hose, changes: SceneChanges) {
    const fromComp = hose.from.portId !== null ? this.portOwner.get(hose.from.portId) : undefined
    const toComp = hose.to.portId !== null ? this.portOwner.get(hose.to.portId) : undefined
    const entry = this.hoseEntries.get(hose.id)
    if (entry && entry.geom.hose === hose && entry.fromComp === fromComp && entry.toComp === toComp) return
    const geom = this.hoseGeometry(hose)
    this.hoseEntries.set(hose.id, { geom, fromComp, toComp })
    this.hoses.set(hose.id, geom)
    changes.hoses.add(hose.id)
  }

  private rebuildHoses(hoses: readonly Hose[], changes: SceneChanges) {
    this.rebuilds.hoses++
    const seen = new Set<string>()
    this.occupied.clear()
    this.hosesByPart.clear()
    for (const hose of hoses) {
      seen.add(hose.id)
      for (const end of [hose.from, hose.to]) {
        if (end.portId === null) continue
        this.occupied.add(end.portId)
        const comp = this.portOwner.get(end.portId)
        if (!comp) continue
        let set = this.hosesByPart.get(comp.id)
        if (!set) this.hosesByPart.set(comp.id, (set = new Set()))
        set.add(hose.id)
      }
      this.refreshHose(hose, changes)
    }
    for (const id of [...this.hoses.keys()]) {
      if (!seen.has(id)) { this.hoses.delete(id); this.hoseEntries.delete(id); changes.removed.add(id) }
    }
  }

  private endPoint(end: Hose['from']): Point3 {
    if (end.portId !== null) {
      const p = this.ports.get(end.portId)
      if (p) return p.world
    }
    return end.point ?? { x: 0, y: 0, z: 0 }
  }

  private hoseGeometry(hose: Hose): HoseGeom {
    const a = this.endPoint(hose.from)
    const b = this.endPoint(hose.to)
    const world = [a, ...hose.params.route, b]
    const flat = planePolyline(this.view, world)
    const pad = hose.insideDiameterMm / 2
    let minU = Infinity, minV = Infinity, maxU = -Infinity, maxV = -Infinity
    for (let i = 0; i < flat.length; i += 2) {
      minU = Math.min(minU, flat[i]!); maxU = Math.max(maxU, flat[i]!)
      minV = Math.min(minV, flat[i + 1]!); maxV = Math.max(maxV, flat[i + 1]!)
    }
    return {
      id: hose.id, hose, world, flat,
      bounds: { minU: minU - pad, minV: minV - pad, maxU: maxU + pad, maxV: maxV + pad },
      crosses: crossesItself(flat),
      tooShort: measuredTooShort(hose.measuredLengthMm, [a, b]),
    }
  }

  /** Bounds of the given elements (parts, ports, hoses), or of everything; null when there is nothing. */
  bounds(ids?: Iterable<string>): PlaneRect | null {
    let r: PlaneRect | null = null
    if (!ids) {
      for (const p of this.parts.values()) r = unionRect(r, p.bounds)
      for (const h of this.hoses.values()) r = unionRect(r, h.bounds)
      return r
    }
    for (const id of ids) {
      const part = this.parts.get(id)
      const hose = this.hoses.get(id)
      const port = this.ports.get(id)
      if (part) r = unionRect(r, part.bounds)
      if (hose) r = unionRect(r, hose.bounds)
      if (port) r = unionRect(r, { minU: port.u - 20, minV: port.v - 20, maxU: port.u + 20, maxV: port.v + 20 })
    }
    return r
  }
}
