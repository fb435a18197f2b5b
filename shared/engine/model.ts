// An indexed, stably ordered view of a circuit. Everything downstream iterates these arrays, never the
// document's own order, so a report does not change when elements are reordered or ids renamed.
import {
  polylineLengthMm, portWorldPosition,
  type Circuit, type Component, type Hose, type Point3, type Port,
} from '../circuit'

export interface PortInfo {
  port: Port
  comp: CompInfo
  world: Point3
  /** the hose end joined to this port, if any */
  joined: { hose: HoseInfo; end: 'from' | 'to' } | null
  rank: number
}

export interface CompInfo {
  comp: Component
  ports: PortInfo[]
  /** highest point of the part: its position or its highest port, mm */
  topZ: number
  rank: number
}

export interface HoseEndInfo {
  name: 'from' | 'to'
  port: PortInfo | null
  point: Point3
}

export interface HoseInfo {
  hose: Hose
  /** H1, H2, … in stable order */
  tag: string
  from: HoseEndInfo
  to: HoseEndInfo
  /** end, route points, end */
  points: Point3[]
  drawnLengthMm: number
  /** measured length when given, else drawn: the length coolant flows through */
  lengthMm: number
  rank: number
}

export interface CircuitModel {
  circuit: Circuit
  components: CompInfo[]
  ports: PortInfo[]
  hoses: HoseInfo[]
  compById: Map<string, CompInfo>
  portById: Map<string, PortInfo>
  hoseById: Map<string, HoseInfo>
  /** one order over every element: parts, then ports, then hoses */
  rankOf: (id: string) => number
}

const compareText = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0)

function comparePoints(a: Point3, b: Point3): number {
  return a.x - b.x || a.y - b.y || a.z - b.z
}

export function buildModel(circuit: Circuit): CircuitModel {
  // Parts ordered by kind, place, then wording; the id breaks ties only between identical twins.
  const comps = [...circuit.components].sort(
    (a, b) =>
      compareText(a.type, b.type) ||
      comparePoints(a.position, b.position) ||
      compareText(a.label, b.label) ||
      a.rotationDeg - b.rotationDeg || a.volumeL - b.volumeL || a.ports.length - b.ports.length ||
      compareText(a.id, b.id),
  )
  const components: CompInfo[] = []
  const ports: PortInfo[] = []
  const compById = new Map<string, CompInfo>()
  const portById = new Map<string, PortInfo>()
  for (const comp of comps) {
    const info: CompInfo = { comp, ports: [], topZ: comp.position.z, rank: components.length }
    const sortedPorts = [...comp.ports].sort(
      (a, b) =>
        comparePoints(a.offset, b.offset) ||
        compareText(a.name, b.name) || compareText(a.role, b.role) ||
        a.spigotOdMm - b.spigotOdMm || Number(a.blocked) - Number(b.blocked) || compareText(a.id, b.id),
    )
    for (const port of sortedPorts) {
      const world = portWorldPosition(comp, port)
      const p: PortInfo = { port, comp: info, world, joined: null, rank: 0 }
      info.ports.push(p)
      if (world.z > info.topZ) info.topZ = world.z
      portById.set(port.id, p)
    }
    components.push(info)
    compById.set(comp.id, info)
  }
  for (const c of components) for (const p of c.ports) { p.rank = ports.length; ports.push(p) }

  const endInfo = (h: Hose, name: 'from' | 'to'): HoseEndInfo => {
    const end = h[name]
    const port = end.portId === null ? null : portById.get(end.portId) ?? null
    return { name, port, point: port ? port.world : end.point ?? { x: 0, y: 0, z: 0 } }
  }
  const drafts = circuit.hoses.map((hose) => {
    const from = endInfo(hose, 'from')
    const to = endInfo(hose, 'to')
    const points = [from.point, ...hose.params.route, to.point]
    const drawnLengthMm = polylineLengthMm(points)
    return { hose, from, to, points, drawnLengthMm }
  })
  drafts.sort(
    (a, b) =>
      comparePoints(a.from.point, b.from.point) ||
      comparePoints(a.to.point, b.to.point) ||
      a.hose.insideDiameterMm - b.hose.insideDiameterMm || a.hose.wallMm - b.hose.wallMm ||
      a.drawnLengthMm - b.drawnLengthMm || (a.hose.measuredLengthMm ?? -1) - (b.hose.measuredLengthMm ?? -1) ||
      compareText(a.hose.material, b.hose.material) || compareText(a.hose.id, b.hose.id),
  )
  const hoses: HoseInfo[] = drafts.map((d, i) => ({
    ...d,
    tag: `H${i + 1}`,
    lengthMm: d.hose.measuredLengthMm ?? d.drawnLengthMm,
    rank: i,
  }))
  const hoseById = new Map<string, HoseInfo>()
  for (const h of hoses) {
    hoseById.set(h.hose.id, h)
    for (const end of [h.from, h.to]) if (end.port) end.port.joined = { hose: h, end: end.name }
  }
  const nComp = components.length
  const nPort = ports.length
  const rankOf = (id: string): number => {
    const c = compById.get(id)
    if (c) return c.rank
    const p = portById.get(id)
    if (p) return nComp + p.rank
    const h = hoseById.get(id)
    if (h) return nComp + nPort + h.rank
    return Number.MAX_SAFE_INTEGER
  }
  return { circuit, components, ports, hoses, compById, portById, hoseById, rankOf }
}

/** "Engine › heater outlet" — how a fabricator finds a port on the vehicle. */
export function portName(p: PortInfo): string {
  return `${p.comp.comp.label} › ${p.port.name}`
}

export function hoseName(h: HoseInfo): string {
  return h.hose.params.label ? `hose ${h.tag} (${h.hose.params.label})` : `hose ${h.tag}`
}

export function endName(e: HoseEndInfo): string {
  return e.port ? portName(e.port) : `free end at (${fmt(e.point.x)}, ${fmt(e.point.y)}, ${fmt(e.point.z)}) mm`
}

/** Numbers in messages: whole when large, one decimal when small, never "-0". */
export function fmt(n: number, decimals?: number): string {
  const d = decimals ?? (Math.abs(n) >= 100 ? 0 : Math.abs(n) >= 10 ? 1 : 2)
  const s = n.toFixed(d)
  return /^-0(\.0+)?$/.test(s) ? s.slice(1) : s
}

/** A size in mm as a fabricator writes it: 16, 15.88, 7.94 (two decimals at most, no trailing zeros). */
export function size(mm: number): string {
  return String(Number(mm.toFixed(2)))
}
