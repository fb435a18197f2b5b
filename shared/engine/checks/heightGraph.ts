// The graph the height checks walk: the top of every part, its ports, the free hose ends and the
// route points, joined part top to port and along each hose. Held in typed arrays (a circuit of a
// thousand parts and hoses has some three thousand vertices). Overflow bottles and their hoses sit
// outside the sealed circuit and are left out.
import type { AnalysisContext } from '../context'
import type { HoseInfo } from '../model'

export const PART_TOP = 0
export const PORT = 1
export const FREE_END = 2
export const ROUTE_POINT = 3

const VENT_TYPES = new Set(['bleed-valve', 'pressure-cap', 'expansion-tank', 'deaeration-pot'])

export interface HeightGraph {
  /** height of each vertex, mm */
  z: Float64Array
  kind: Uint8Array
  /** part rank (part top), port rank (port) or hose rank (free end, route point) */
  ref: Int32Array
  /** route point: its index in the route; free end: 0 for `from`, 1 for `to` */
  sub: Int32Array
  /** air can be let out here */
  vent: Uint8Array
  /** an open port or free hose end: air (and coolant) already escapes here */
  open: Uint8Array
  /** neighbours of v: adjacent[start[v] … start[v + 1]) */
  start: Int32Array
  adjacent: Int32Array
}

const isOverflowLine = (h: HoseInfo) =>
  h.from.port?.comp.comp.type === 'overflow-bottle' || h.to.port?.comp.comp.type === 'overflow-bottle'

const heightGraphs = new WeakMap<AnalysisContext, HeightGraph>()

/** The height graph, built once per analysis and shared by the air-trap and filler checks. */
export function heightGraphOf(ctx: AnalysisContext): HeightGraph {
  let g = heightGraphs.get(ctx)
  if (!g) { g = buildHeightGraph(ctx); heightGraphs.set(ctx, g) }
  return g
}

export function buildHeightGraph(ctx: AnalysisContext): HeightGraph {
  const { components, ports, hoses } = ctx.model
  // sizes first, so that every array is allocated once
  let n = 0
  let links = 0
  for (const c of components) if (c.comp.type !== 'overflow-bottle') { n += 1 + c.ports.length; links += c.ports.length }
  for (const h of hoses) {
    if (isOverflowLine(h)) continue
    n += h.hose.params.route.length + (h.from.port ? 0 : 1) + (h.to.port ? 0 : 1)
    links += h.hose.params.route.length + 1
  }
  const z = new Float64Array(n)
  const kind = new Uint8Array(n)
  const ref = new Int32Array(n)
  const sub = new Int32Array(n)
  const vent = new Uint8Array(n)
  const open = new Uint8Array(n)
  const linkA = new Int32Array(links)
  const linkB = new Int32Array(links)
  const portVertex = new Int32Array(ports.length).fill(-1)
  let count = 0
  let linkCount = 0
  const add = (height: number, k: number, r: number, s: number, isVent: boolean, isOpen: boolean) => {
    z[count] = height
    kind[count] = k
    ref[count] = r
    sub[count] = s
    vent[count] = isVent ? 1 : 0
    open[count] = isOpen ? 1 : 0
    return count++
  }
  const link = (a: number, b: number) => { linkA[linkCount] = a; linkB[linkCount++] = b }
  for (const c of components) {
    if (c.comp.type === 'overflow-bottle') continue
    const ventPart = VENT_TYPES.has(c.comp.type)
    const top = add(c.topZ, PART_TOP, c.rank, 0, ventPart, false)
    for (const p of c.ports) {
      const role = p.port.role
      const pv = add(p.world.z, PORT, p.rank, 0, ventPart || role === 'vent' || role === 'fill', !p.port.blocked && !p.joined)
      portVertex[p.rank] = pv
      link(top, pv)
    }
  }
  for (const h of hoses) {
    if (isOverflowLine(h)) continue
    let prev = h.from.port ? portVertex[h.from.port.rank]! : add(h.from.point.z, FREE_END, h.rank, 0, false, true)
    const route = h.hose.params.route
    for (let i = 0; i < route.length; i++) {
      const v = add(route[i]!.z, ROUTE_POINT, h.rank, i, false, false)
      link(prev, v)
      prev = v
    }
    link(prev, h.to.port ? portVertex[h.to.port.rank]! : add(h.to.point.z, FREE_END, h.rank, 1, false, true))
  }
  // neighbour lists in the order the links were made, each link in both lists
  const start = new Int32Array(n + 1)
  for (let k = 0; k < links; k++) { start[linkA[k]! + 1]!++; start[linkB[k]! + 1]!++ }
  for (let v = 0; v < n; v++) start[v + 1]! += start[v]!
  const fill = start.slice(0, n)
  const adjacent = new Int32Array(2 * links)
  for (let k = 0; k < links; k++) {
    adjacent[fill[linkA[k]!]!++] = linkB[k]!
    adjacent[fill[linkB[k]!]!++] = linkA[k]!
  }
  return { z, kind, ref, sub, vent, open, start, adjacent }
}

/**
 * Vertex indices from the highest to the lowest; equal heights by index. The heights are sorted as
 * plain numbers (no comparator), then each vertex is dropped into the slot of its height, lowest index
 * first.
 */
export function heightOrder(z: Float64Array): Int32Array {
  const n = z.length
  const sorted = z.slice().sort() // ascending
  // distinct heights and where each one's run of vertices starts in the order (highest first)
  const distinct: number[] = []
  for (let i = 0; i < n; i++) if (i === 0 || sorted[i] !== sorted[i - 1]) distinct.push(sorted[i]!)
  const counts = new Int32Array(distinct.length + 1)
  const slotOf = new Int32Array(n)
  for (let v = 0; v < n; v++) {
    // binary search for z[v] among the distinct heights; slot 0 is the highest
    let lo = 0
    let hi = distinct.length - 1
    const x = z[v]!
    while (lo < hi) {
      const mid = (lo + hi) >> 1
      if (distinct[mid]! < x) lo = mid + 1
      else hi = mid
    }
    const slot = distinct.length - 1 - lo
    slotOf[v] = slot
    counts[slot + 1]!++
  }
  for (let s = 0; s < distinct.length; s++) counts[s + 1]! += counts[s]!
  const order = new Int32Array(n)
  for (let v = 0; v < n; v++) order[counts[slotOf[v]!]!++] = v
  return order
}
