// Air traps and the filler height. Heights come from port positions (part z + offset z), the tops of
// parts (their highest port or position) and the hose route points. Overflow bottles and their hoses
// sit outside the sealed circuit and are left out.
import type { Point3 } from '../../circuit'
import { makeFinding, type AnalysisContext, type Check } from '../context'
import { fmt, hoseName, portName, type CompInfo, type HoseInfo, type PortInfo } from '../model'
import type { Finding } from '../report'

const VENT_TYPES = new Set(['bleed-valve', 'pressure-cap', 'expansion-tank', 'deaeration-pot'])
const FILL_TYPES = new Set(['pressure-cap', 'expansion-tank', 'deaeration-pot'])

interface HeightVertex {
  z: number
  at: Point3
  comp?: CompInfo
  port?: PortInfo
  hose?: HoseInfo
  /** air can be let out here */
  vent: boolean
  /** an open port or free hose end: air (and coolant) already escapes here */
  open: boolean
}

export interface HeightGraph {
  vertices: HeightVertex[]
  neighbours: number[][]
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
  const vertices: HeightVertex[] = []
  const neighbours: number[][] = []
  const add = (v: HeightVertex) => { vertices.push(v); neighbours.push([]); return vertices.length - 1 }
  const link = (a: number, b: number) => { neighbours[a]!.push(b); neighbours[b]!.push(a) }
  const portVertex = new Map<PortInfo, number>()
  for (const c of ctx.model.components) {
    if (c.comp.type === 'overflow-bottle') continue
    const ventPart = VENT_TYPES.has(c.comp.type)
    const centre = add({ z: c.topZ, at: { x: c.comp.position.x, y: c.comp.position.y, z: c.topZ }, comp: c, vent: ventPart, open: false })
    for (const p of c.ports) {
      const role = p.port.role
      const pv = add({
        z: p.world.z, at: p.world, comp: c, port: p,
        vent: ventPart || role === 'vent' || role === 'fill',
        open: !p.port.blocked && !p.joined,
      })
      portVertex.set(p, pv)
      link(centre, pv)
    }
  }
  for (const h of ctx.model.hoses) {
    if (isOverflowLine(h)) continue
    const endVertex = (end: HoseInfo['from']) =>
      end.port ? portVertex.get(end.port)! : add({ z: end.point.z, at: end.point, hose: h, vent: false, open: true })
    let prev = endVertex(h.from)
    for (const r of h.hose.params.route) {
      const v = add({ z: r.z, at: r, hose: h, vent: false, open: false })
      link(prev, v)
      prev = v
    }
    link(prev, endVertex(h.to))
  }
  return { vertices, neighbours }
}

/**
 * Peaks by topographic prominence: sweep the vertices from the top down, merging neighbours with a
 * union-find; when two pieces meet at height z, the lower peak's prominence is its height minus z.
 * A peak whose prominence exceeds the tolerance is a real high point (a rise then a fall along a path).
 */
export function significantPeaks(g: HeightGraph, toleranceMm: number): number[] {
  const n = g.vertices.length
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => g.vertices[b]!.z - g.vertices[a]!.z || a - b)
  const parent = new Int32Array(n).fill(-1)
  const peak = new Int32Array(n)
  const find = (x: number): number => {
    let r = x
    while (parent[r] !== r) r = parent[r]!
    while (parent[x] !== r) { const nx = parent[x]!; parent[x] = r; x = nx }
    return r
  }
  const higher = (a: number, b: number) => g.vertices[a]!.z > g.vertices[b]!.z || (g.vertices[a]!.z === g.vertices[b]!.z && a < b)
  const result: number[] = []
  for (const v of order) {
    parent[v] = v
    peak[v] = v
    const z = g.vertices[v]!.z
    for (const u of g.neighbours[v]!) {
      if (parent[u] === -1) continue
      const ru = find(u)
      const rv = find(v)
      if (ru === rv) continue
      const [keep, lose] = higher(peak[ru]!, peak[rv]!) ? [ru, rv] : [rv, ru]
      const lostPeak = peak[lose]!
      if (lostPeak !== v && g.vertices[lostPeak]!.z - z > toleranceMm) result.push(lostPeak)
      parent[lose] = keep
    }
  }
  for (let v = 0; v < n; v++) if (parent[v] === v) result.push(peak[v]!) // the top of each separate piece
  return result.sort((a, b) => a - b)
}

/** Vertices joined to the peak through points no more than the tolerance below it. */
function crestOf(g: HeightGraph, p: number, toleranceMm: number): number[] {
  const floor = g.vertices[p]!.z - toleranceMm
  const seen = new Set<number>([p])
  const queue = [p]
  for (let i = 0; i < queue.length; i++) {
    for (const u of g.neighbours[queue[i]!]!) {
      if (!seen.has(u) && g.vertices[u]!.z >= floor) { seen.add(u); queue.push(u) }
    }
  }
  return queue
}

function elementIdsOf(vs: HeightVertex[]): string[] {
  const ids: string[] = []
  for (const v of vs) {
    if (v.port) ids.push(v.port.port.id)
    else if (v.comp) ids.push(v.comp.comp.id)
    if (v.hose) ids.push(v.hose.hose.id)
  }
  return ids
}

export const airTraps: Check = (ctx) => {
  const g = heightGraphOf(ctx)
  const tol = ctx.thresholds.airTrapToleranceMm
  const out: Finding[] = []
  for (const p of significantPeaks(g, tol)) {
    const crest = crestOf(g, p, tol).map((i) => g.vertices[i]!)
    if (crest.some((v) => v.vent || v.open)) continue
    if (crest.length === 1 && g.neighbours[p]!.length <= 1 && !crest[0]!.hose) continue // a single blind port
    const top = g.vertices[p]!
    const where = `(${fmt(top.at.x, 0)}, ${fmt(top.at.y, 0)}) mm at ${fmt(top.z, 0)} mm height`
    const hoseAtTop = top.hose ?? crest.find((v) => v.hose && !v.port)?.hose
    if (hoseAtTop) {
      out.push(makeFinding(ctx, 'air-trap', 'warning',
        `${capitalise(hoseName(hoseAtTop))} rises to a high point at ${where} and falls away on both sides; air collects there and nothing lets it out.`,
        elementIdsOf(crest),
        `Fit a bleed valve (a tee with a bleed screw) in ${hoseAtTop.tag} at the high point, or re-route it so it rises steadily to a vent.`,
        { type: 'add-bleed-valve', hoseId: hoseAtTop.hose.id, at: top.at }))
    } else {
      const comp = top.comp!
      const at = { x: comp.comp.position.x, y: comp.comp.position.y, z: comp.topZ }
      const portText = top.port ? ` at ${portName(top.port)}` : ''
      out.push(makeFinding(ctx, 'air-trap', 'warning',
        `${comp.comp.label} is a high point${portText} (${fmt(top.z, 0)} mm): the hoses either side run lower, so air collects in it and nothing lets it out.`,
        elementIdsOf(crest),
        `Fit a bleed screw at the top of ${comp.comp.label}, or run a vent line from its top up to the expansion tank.`,
        { type: 'add-vent-port', componentId: comp.comp.id, at }))
    }
  }
  return out
}

export const fillNotHighest: Check = (ctx) => {
  if (ctx.doc.circuit.kind !== 'coolant') return []
  const g = heightGraphOf(ctx)
  const tol = ctx.thresholds.airTrapToleranceMm
  let fill: HeightVertex | null = null
  for (const v of g.vertices) {
    const isFill = (v.comp && !v.port && FILL_TYPES.has(v.comp.comp.type)) || v.port?.port.role === 'fill'
    if (isFill && (!fill || v.z > fill.z)) fill = v
  }
  if (!fill) return []
  const fillComp = fill.comp!
  const above = g.vertices.filter((v) => v.z > fill.z + tol && v.comp !== fillComp)
  if (above.length === 0) return []
  const highest = above.reduce((a, b) => (b.z > a.z ? b : a))
  const name = highest.port ? portName(highest.port) : highest.hose ? hoseName(highest.hose) : highest.comp!.comp.label
  const rise = Math.ceil((highest.z - fill.z + tol) / 10) * 10
  const others = new Set(above.map((v) => v.hose?.tag ?? v.comp?.comp.label ?? ''))
  return [
    makeFinding(ctx, 'fill-not-highest', 'warning',
      `${capitalise(name)} is at ${fmt(highest.z, 0)} mm, ${fmt(highest.z - fill.z, 0)} mm above the filler on ${fillComp.comp.label} (${fmt(fill.z, 0)} mm)` +
        `${others.size > 1 ? `; also above it: ${[...others].filter((o) => o !== (highest.hose?.tag ?? highest.comp?.comp.label)).join(', ')}` : ''}. ` +
        'The circuit cannot be filled to the top from the filler, and air will stay above it.',
      [...elementIdsOf(above), fillComp.comp.id],
      `Raise ${fillComp.comp.label} by at least ${fmt(rise, 0)} mm so its filler is the highest point, or lower the parts above it.`,
      { type: 'raise-component', componentId: fillComp.comp.id, z: fillComp.comp.position.z + rise }),
  ]
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1)
}
