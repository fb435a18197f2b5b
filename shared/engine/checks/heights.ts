// Air traps and the filler height. Heights come from port positions (part z + offset z), the tops of
// parts (their highest port or position) and the hose route points. Overflow bottles and their hoses
// sit outside the sealed circuit and are left out.
import type { Point3 } from '../../circuit'
import { makeFinding, type AnalysisContext, type Check } from '../context'
import { fmt, hoseName, portName, type CompInfo, type HoseInfo, type PortInfo } from '../model'
import type { Finding } from '../report'
import { heightOrder, type HeightGraph, heightGraphOf, PART_TOP, PORT, ROUTE_POINT } from './heightGraph'

const FILL_TYPES = new Set(['pressure-cap', 'expansion-tank', 'deaeration-pot'])

/**
 * Peaks by topographic prominence: sweep the vertices from the top down, merging neighbours with a
 * union-find; when two pieces meet at height z, the lower peak's prominence is its height minus z.
 * A peak whose prominence exceeds the tolerance is a real high point (a rise then a fall along a path).
 */
export function significantPeaks(g: HeightGraph, toleranceMm: number): number[] {
  const { z, start, adjacent } = g
  const n = z.length
  const order = heightOrder(z)
  const parent = new Int32Array(n).fill(-1)
  const peak = new Int32Array(n)
  const find = (x: number): number => {
    let r = x
    while (parent[r] !== r) r = parent[r]!
    while (parent[x] !== r) { const nx = parent[x]!; parent[x] = r; x = nx }
    return r
  }
  const result: number[] = []
  for (let k = 0; k < n; k++) {
    const v = order[k]!
    parent[v] = v
    peak[v] = v
    const zv = z[v]!
    for (let a = start[v]!; a < start[v + 1]!; a++) {
      const u = adjacent[a]!
      if (parent[u] === -1) continue
      const ru = find(u)
      const rv = find(v)
      if (ru === rv) continue
      const pu = peak[ru]!
      const pv = peak[rv]!
      // the higher peak (ties: the lower index) keeps the merged piece
      const uHigher = z[pu]! > z[pv]! || (z[pu] === z[pv] && pu < pv)
      const keep = uHigher ? ru : rv
      const lose = uHigher ? rv : ru
      const lostPeak = peak[lose]!
      if (lostPeak !== v && z[lostPeak]! - zv > toleranceMm) result.push(lostPeak)
      parent[lose] = keep
    }
  }
  for (let v = 0; v < n; v++) if (parent[v] === v) result.push(peak[v]!) // the top of each separate piece
  return result.sort((a, b) => a - b)
}

/** Vertices joined to the peak through points no more than the tolerance below it. */
function crestOf(g: HeightGraph, p: number, toleranceMm: number, seen: Uint8Array): number[] {
  const floor = g.z[p]! - toleranceMm
  const queue = [p]
  seen[p] = 1
  for (let i = 0; i < queue.length; i++) {
    const v = queue[i]!
    for (let a = g.start[v]!; a < g.start[v + 1]!; a++) {
      const u = g.adjacent[a]!
      if (!seen[u] && g.z[u]! >= floor) { seen[u] = 1; queue.push(u) }
    }
  }
  for (const v of queue) seen[v] = 0
  return queue
}

function elementIdsOf(ctx: AnalysisContext, g: HeightGraph, vs: readonly number[]): string[] {
  const ids: string[] = []
  for (const v of vs) {
    const port = portAt(ctx, g, v)
    const comp = compAt(ctx, g, v)
    const hose = hoseAt(ctx, g, v)
    if (port) ids.push(port.port.id)
    else if (comp) ids.push(comp.comp.id)
    if (hose) ids.push(hose.hose.id)
  }
  return ids
}

const compAt = (ctx: AnalysisContext, g: HeightGraph, v: number): CompInfo | undefined =>
  g.kind[v] === PART_TOP ? ctx.model.components[g.ref[v]!] : g.kind[v] === PORT ? ctx.model.ports[g.ref[v]!]!.comp : undefined
const portAt = (ctx: AnalysisContext, g: HeightGraph, v: number): PortInfo | undefined =>
  g.kind[v] === PORT ? ctx.model.ports[g.ref[v]!] : undefined
const hoseAt = (ctx: AnalysisContext, g: HeightGraph, v: number): HoseInfo | undefined =>
  g.kind[v] !== PART_TOP && g.kind[v] !== PORT ? ctx.model.hoses[g.ref[v]!] : undefined

/** Where a vertex is, mm. */
function pointAt(ctx: AnalysisContext, g: HeightGraph, v: number): Point3 {
  const ref = g.ref[v]!
  switch (g.kind[v]) {
    case PART_TOP: {
      const c = ctx.model.components[ref]!
      return { x: c.comp.position.x, y: c.comp.position.y, z: c.topZ }
    }
    case PORT: return ctx.model.ports[ref]!.world
    case ROUTE_POINT: return ctx.model.hoses[ref]!.hose.params.route[g.sub[v]!]!
    default: return g.sub[v] === 0 ? ctx.model.hoses[ref]!.from.point : ctx.model.hoses[ref]!.to.point
  }
}

export const airTraps: Check = (ctx) => {
  // a fuel pump pushes air on to the return (or out through the injectors): no high point holds it
  if (ctx.doc.circuit.kind !== 'coolant') return []
  const g = heightGraphOf(ctx)
  const tol = ctx.thresholds.airTrapToleranceMm
  const out: Finding[] = []
  const seen = new Uint8Array(g.z.length)
  for (const p of significantPeaks(g, tol)) {
    const crest = crestOf(g, p, tol, seen)
    if (crest.some((v) => g.vent[v] || g.open[v])) continue
    const top = p
    const topHose = g.kind[top] === PART_TOP || g.kind[top] === PORT ? undefined : hoseAt(ctx, g, top)
    if (crest.length === 1 && g.start[p + 1]! - g.start[p]! <= 1 && !topHose) continue // a single blind port
    const at = pointAt(ctx, g, top)
    const where = `(${fmt(at.x, 0)}, ${fmt(at.y, 0)}) mm at ${fmt(g.z[top]!, 0)} mm height`
    const routeOnCrest = crest.find((v) => g.kind[v] !== PART_TOP && g.kind[v] !== PORT)
    const hoseAtTop = topHose ?? (routeOnCrest !== undefined ? hoseAt(ctx, g, routeOnCrest) : undefined)
    if (hoseAtTop) {
      out.push(makeFinding(ctx, 'air-trap', 'warning',
        `${capitalise(hoseName(hoseAtTop))} rises to a high point at ${where} and falls away on both sides; air collects there and nothing lets it out.`,
        elementIdsOf(ctx, g, crest),
        `Fit a bleed valve (a tee with a bleed screw) in ${hoseAtTop.tag} at the high point, or re-route it so it rises steadily to a vent.`,
        { type: 'add-bleed-valve', hoseId: hoseAtTop.hose.id, at }))
    } else {
      const comp = compAt(ctx, g, top)!
      const topPort = portAt(ctx, g, top)
      const partTop = { x: comp.comp.position.x, y: comp.comp.position.y, z: comp.topZ }
      const portText = topPort ? ` at ${portName(topPort)}` : ''
      out.push(makeFinding(ctx, 'air-trap', 'warning',
        `${comp.comp.label} is a high point${portText} (${fmt(g.z[top]!, 0)} mm): the hoses either side run lower, so air collects in it and nothing lets it out.`,
        elementIdsOf(ctx, g, crest),
        `Fit a bleed screw at the top of ${comp.comp.label}, or run a vent line from its top up to the expansion tank.`,
        { type: 'add-vent-port', componentId: comp.comp.id, at: partTop }))
    }
  }
  return out
}

export const fillNotHighest: Check = (ctx) => {
  if (ctx.doc.circuit.kind !== 'coolant') return []
  const g = heightGraphOf(ctx)
  const tol = ctx.thresholds.airTrapToleranceMm
  const n = g.z.length
  let fill = -1
  for (let v = 0; v < n; v++) {
    const isFill = g.kind[v] === PART_TOP ? FILL_TYPES.has(compAt(ctx, g, v)!.comp.type) : g.kind[v] === PORT && portAt(ctx, g, v)!.port.role === 'fill'
    if (isFill && (fill < 0 || g.z[v]! > g.z[fill]!)) fill = v
  }
  if (fill < 0) return []
  const fillComp = compAt(ctx, g, fill)!
  const fillZ = g.z[fill]!
  const above: number[] = []
  for (let v = 0; v < n; v++) if (g.z[v]! > fillZ + tol && compAt(ctx, g, v) !== fillComp) above.push(v)
  if (above.length === 0) return []
  let highest = above[0]!
  for (const v of above) if (g.z[v]! > g.z[highest]!) highest = v
  const highestPort = portAt(ctx, g, highest)
  const highestHose = hoseAt(ctx, g, highest)
  const highestComp = compAt(ctx, g, highest)
  const name = highestPort ? portName(highestPort) : highestHose ? hoseName(highestHose) : highestComp!.comp.label
  const rise = Math.ceil((g.z[highest]! - fillZ + tol) / 10) * 10
  const others = new Set(above.map((v) => hoseAt(ctx, g, v)?.tag ?? compAt(ctx, g, v)?.comp.label ?? ''))
  const highestName = highestHose?.tag ?? highestComp?.comp.label
  return [
    makeFinding(ctx, 'fill-not-highest', 'warning',
      `${capitalise(name)} is at ${fmt(g.z[highest]!, 0)} mm, ${fmt(g.z[highest]! - fillZ, 0)} mm above the filler on ${fillComp.comp.label} (${fmt(fillZ, 0)} mm)` +
        `${others.size > 1 ? `; also above it: ${[...others].filter((o) => o !== highestName).join(', ')}` : ''}. ` +
        'The circuit cannot be filled to the top from the filler, and air will stay above it.',
      [...elementIdsOf(ctx, g, above), fillComp.comp.id],
      `Raise ${fillComp.comp.label} by at least ${fmt(rise, 0)} mm so its filler is the highest point, or lower the parts above it.`,
      { type: 'raise-component', componentId: fillComp.comp.id, z: fillComp.comp.position.z + rise }),
  ]
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1)
}
