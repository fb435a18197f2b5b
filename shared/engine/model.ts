// An indexed, stably ordered view of a circuit. Everything downstream iterates these arrays, never the
// document's own order, so a report does not change when elements are reordered or ids renamed.
import {
  distanceMm,
  type Circuit, type Component, type Hose, type Point3, type Port,
} from '../circuit'

export interface PortInfo {
  port: Port
  comp: CompInfo
  world: Point3
  /** the hose joined to this port, if any, and which of its ends */
  joined: HoseInfo | null
  joinedEnd: 'from' | 'to'
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

/** Ports by offset, then wording and size; the id breaks ties only between identical twins. */
function comparePorts(a: Port, b: Port): number {
  return comparePoints(a.offset, b.offset) ||
    compareText(a.name, b.name) || compareText(a.role, b.role) ||
    a.spigotOdMm - b.spigotOdMm || Number(a.blocked) - Number(b.blocked) || compareText(a.id, b.id)
}

/**
 * Hoses by the positions of their ends, then bore, wall and length; material and id only between
 * identical twins. The numbers are read into one array first, so that the comparisons do not chase
 * pointers through the document.
 */
function sortHoses(hoses: HoseInfo[]): void {
  const n = hoses.length
  const keys = new Float64Array(10 * n)
  for (let i = 0; i < n; i++) {
    const h = hoses[i]!
    const f = h.from.point
    const t = h.to.point
    const k = 10 * i
    keys[k] = f.x; keys[k + 1] = f.y; keys[k + 2] = f.z
    keys[k + 3] = t.x; keys[k + 4] = t.y; keys[k + 5] = t.z
    keys[k + 6] = h.hose.insideDiameterMm; keys[k + 7] = h.hose.wallMm
    keys[k + 8] = h.drawnLengthMm; keys[k + 9] = h.hose.measuredLengthMm ?? -1
  }
  const order = Array.from({ length: n }, (_, i) => i)
  order.sort((a, b) => {
    const ka = 10 * a
    const kb = 10 * b
    for (let j = 0; j < 10; j++) {
      const d = keys[ka + j]! - keys[kb + j]!
      if (d !== 0) return d
    }
    const ha = hoses[a]!.hose
    const hb = hoses[b]!.hose
    return compareText(ha.material, hb.material) || compareText(ha.id, hb.id)
  })
  const sorted = order.map((i) => hoses[i]!)
  for (let i = 0; i < n; i++) hoses[i] = sorted[i]!
}

/** Insertion sort: a part has a handful of ports, and Array.sort's set-up costs more than the sort. */
function sortSmall<T>(items: T[], compare: (a: T, b: T) => number): T[] {
  for (let i = 1; i < items.length; i++) {
    const x = items[i]!
    let j = i - 1
    while (j >= 0 && compare(items[j]!, x) > 0) { items[j + 1] = items[j]!; j-- }
    items[j + 1] = x
  }
  return items
}

/**
 * Length through end, route points, end: the sum of the straight pieces, as polylineLengthMm
 * (shared/circuit) adds them, without building the list of points.
 */
export function routeLengthMm(from: Point3, route: readonly Point3[], to: Point3): number {
  let total = 0
  let a = from
  for (const b of route) { total += distanceMm(a, b); a = b }
  return total + distanceMm(a, to)
}

export function buildModel(circuit: Circuit): CircuitModel {
  // Parts ordered by kind, place, then wording; the id breaks ties only between identical twins.
  const comps = circuit.components.slice().sort(
    (a, b) =>
      compareText(a.type, b.type) ||
      comparePoints(a.position, b.position) ||
      compareText(a.label, b.label) ||
      a.rotationDeg - b.rotationDeg || a.volumeL - b.volumeL || a.ports.length - b.ports.length ||
      compareText(a.id, b.id),
  )
  const components: CompInfo[] = new Array(comps.length)
  const ports: PortInfo[] = []
  const compById = new Map<string, CompInfo>()
  const portById = new Map<string, PortInfo>()
  for (let ci = 0; ci < comps.length; ci++) {
    const comp = comps[ci]!
    const info: CompInfo = { comp, ports: [], topZ: comp.position.z, rank: ci }
    const sortedPorts = comp.ports.length < 2 ? comp.ports : sortSmall(comp.ports.slice(), comparePorts)
    // portWorldPosition, with the part's rotation worked out once
    const a = (comp.rotationDeg * Math.PI) / 180
    const cos = Math.cos(a)
    const sin = Math.sin(a)
    const { x: px, y: py, z: pz } = comp.position
    for (const port of sortedPorts) {
      const o = port.offset
      const world = { x: px + o.x * cos - o.y * sin, y: py + o.x * sin + o.y * cos, z: pz + o.z }
      const p: PortInfo = { port, comp: info, world, joined: null, joinedEnd: 'from', rank: ports.length }
      info.ports.push(p)
      ports.push(p)
      if (world.z > info.topZ) info.topZ = world.z
      portById.set(port.id, p)
    }
    components[ci] = info
    compById.set(comp.id, info)
  }

  const endInfo = (h: Hose, name: 'from' | 'to'): HoseEndInfo => {
    const end = h[name]
    const port = end.portId === null ? null : portById.get(end.portId) ?? null
    return { name, port, point: port ? port.world : end.point ?? { x: 0, y: 0, z: 0 } }
  }
  const hoses: HoseInfo[] = circuit.hoses.map((hose) => {
    const from = endInfo(hose, 'from')
    const to = endInfo(hose, 'to')
    const drawnLengthMm = routeLengthMm(from.point, hose.params.route, to.point)
    return { hose, tag: '', from, to, drawnLengthMm, lengthMm: hose.measuredLengthMm ?? drawnLengthMm, rank: 0 }
  })
  sortHoses(hoses)
  const hoseById = new Map<string, HoseInfo>()
  for (let i = 0; i < hoses.length; i++) {
    const h = hoses[i]!
    h.rank = i
    h.tag = `H${i + 1}`
    hoseById.set(h.hose.id, h)
    if (h.from.port) { h.from.port.joined = h; h.from.port.joinedEnd = 'from' }
    if (h.to.port) { h.to.port.joined = h; h.to.port.joinedEnd = 'to' }
  }
  // one order over every element: parts, then ports, then hoses
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
  let text = sizeTexts.get(mm)
  if (text === undefined) {
    text = String(Number(mm.toFixed(2)))
    // a drawing has a handful of sizes; the cache only saves formatting them over and over
    if (sizeTexts.size > 4096) sizeTexts.clear()
    sizeTexts.set(mm, text)
  }
  return text
}
const sizeTexts = new Map<number, string>()
