// Head-loss laws of the network's links, in SI: flow Q in m³/s, head h in m of the circulating fluid.
// This file turns a NetworkLink into its law's constants; link-table.ts evaluates h(Q) and dh/dQ.

import type { FrictionPoint } from '../friction'
import { STANDARD_GRAVITY } from '../units'
import type { NetworkLink } from '../types'

// a local copy: a module binding can cost a getter call per use in some module loaders
const G = STANDARD_GRAVITY

/**
 * Below this flow a quadratic law (fittings, lumped resistances) is continued linearly through zero
 * (h = r·Q_lin·Q), a laminar-like floor that keeps the Newton slope positive at zero flow so dead legs
 * converge in one step. 1e-7 m³/s = 0.006 L/min, far below any flow a coolant circuit cares about.
 */
export const QUADRATIC_LAW_LINEAR_BELOW_M3S = 1e-7

export interface PipeLaw {
  kind: 'pipe'
  lengthM: number
  diameterM: number
  relativeRoughness: number
  minorK: number
  area: number
  kinematicViscosity: number
}

export interface QuadraticLaw {
  kind: 'quadratic'
  /** h = r·Q|Q| */
  r: number
  /** bore for velocity reports, if the resistance has one */
  diameterM: number | null
}

export interface PumpCurveLaw {
  kind: 'pump-curve'
  /** pump head = c0 + c1·Q + c2·Q² (m, Q in m³/s) on 0 ≤ Q ≤ qHigh */
  c0: number
  c1: number
  c2: number
  /** beyond qHigh the head falls on a straight line of slope slopeHigh (< 0) */
  qHigh: number
  slopeHigh: number
  /** below zero flow (reverse flow) the head rises on a straight line of slope slopeLow (< 0) */
  slopeLow: number
  /** smallest slope used in the Newton step (the curve itself is not altered) */
  minSlope: number
  /** flow at the middle of the stated curve, the starting guess */
  designFlow: number
  /** set when the quadratic turned upwards inside the stated range and was continued as a line */
  adjusted?: string
}

/** Pump head (m) and dhead/dQ for the piecewise curve described on PumpCurveLaw. */
export function pumpHead(law: PumpCurveLaw, q: number): { head: number; slope: number } {
  if (q < 0) return { head: law.c0 + law.slopeLow * q, slope: law.slopeLow }
  if (q > law.qHigh) {
    const atHigh = law.c0 + law.c1 * law.qHigh + law.c2 * law.qHigh * law.qHigh
    return { head: atHigh + law.slopeHigh * (q - law.qHigh), slope: law.slopeHigh }
  }
  return { head: law.c0 + law.c1 * q + law.c2 * q * q, slope: law.c1 + 2 * law.c2 * q }
}

export interface FixedFlowLaw {
  kind: 'fixed-flow'
  flow: number
}

export type LinkLaw = PipeLaw | QuadraticLaw | PumpCurveLaw | FixedFlowLaw

/** Friction factor and slope for Re ≥ 2300 (below that the laminar law always applies). */
export type FrictionLaw = (re: number, relativeRoughness: number) => Pick<FrictionPoint, 'f' | 'dfdRe'>

/** Quadratic through the given (Q, head) points: exact for 3, least squares for more. */
export function fitPumpCurve(points: ReadonlyArray<{ flowLpm: number; headM: number }>): { c0: number; c1: number; c2: number } {
  const pts = points.map(p => ({ q: p.flowLpm / 60000, h: p.headM })).sort((a, b) => a.q - b.q)
  if (pts.length === 0) throw new Error('a pump curve needs at least one point')
  if (pts.length === 1) {
    // one design point: the customary curve with shut-off at 4/3 of the head and run-out at twice the flow
    const { q, h } = pts[0]!
    return { c0: (4 / 3) * h, c1: 0, c2: q > 0 ? -h / (3 * q * q) : 0 }
  }
  if (pts.length === 2) {
    // h = c0 + c2·Q² through both points
    const [a, b] = [pts[0]!, pts[1]!]
    const c2 = (b.h - a.h) / (b.q * b.q - a.q * a.q)
    return { c0: a.h - c2 * a.q * a.q, c1: 0, c2 }
  }
  // normal equations of the least-squares quadratic; with three points they reproduce the exact fit
  const s = [0, 0, 0, 0, 0]
  const t = [0, 0, 0]
  for (const { q, h } of pts) {
    let qp = 1
    for (let k = 0; k < 5; k++) {
      s[k]! += qp
      if (k < 3) t[k]! += qp * h
      qp *= q
    }
  }
  const m = [[s[0]!, s[1]!, s[2]!], [s[1]!, s[2]!, s[3]!], [s[2]!, s[3]!, s[4]!]]
  const [c0, c1, c2] = solve3(m, t)
  return { c0, c1, c2 }
}

function solve3(m: number[][], rhs: number[]): [number, number, number] {
  const a = m.map((row, i) => [...row, rhs[i]!])
  for (let col = 0; col < 3; col++) {
    let pivot = col
    for (let r = col + 1; r < 3; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[pivot]![col]!)) pivot = r
    ;[a[col], a[pivot]] = [a[pivot]!, a[col]!]
    for (let r = col + 1; r < 3; r++) {
      const factor = a[r]![col]! / a[col]![col]!
      for (let c = col; c < 4; c++) a[r]![c]! -= factor * a[col]![c]!
    }
  }
  const x = [0, 0, 0]
  for (let r = 2; r >= 0; r--) {
    let sum = a[r]![3]!
    for (let c = r + 1; c < 3; c++) sum -= a[r]![c]! * x[c]!
    x[r] = sum / a[r]![r]!
  }
  return [x[0]!, x[1]!, x[2]!]
}

/** Builds the law of a link, or explains why the link cannot carry a defined flow. */
function positive(x: number): boolean {
  return Number.isFinite(x) && x > 0
}

export function linkLaw(link: NetworkLink, densityKgM3: number, viscosityPaS: number): LinkLaw | string {
  switch (link.kind) {
    case 'pipe': {
      if (!positive(link.diameterM)) return `pipe ${link.id}: bore must be above zero`
      if (!(Number.isFinite(link.lengthM) && link.lengthM >= 0)) return `pipe ${link.id}: length must not be negative`
      if (!(Number.isFinite(link.minorK) && link.minorK >= 0)) return `pipe ${link.id}: minor-loss K must not be negative`
      if (!(Number.isFinite(link.roughnessM) && link.roughnessM >= 0)) return `pipe ${link.id}: roughness must not be negative`
      const area = (Math.PI / 4) * link.diameterM * link.diameterM
      // a zero-length, loss-free pipe would merge its nodes; give it 1 mm of laminar friction instead
      const lengthM = link.lengthM > 0 || link.minorK > 0 ? link.lengthM : 1e-3
      return {
        kind: 'pipe', lengthM, diameterM: link.diameterM, relativeRoughness: link.roughnessM / link.diameterM,
        minorK: link.minorK, area, kinematicViscosity: viscosityPaS / densityKgM3,
      }
    }
    case 'resistance': {
      const res = link.resistance
      if ('k' in res) {
        if (!positive(res.k) || !positive(res.diameterM)) return `resistance ${link.id}: K and bore must be above zero`
        const area = (Math.PI / 4) * res.diameterM * res.diameterM
        return { kind: 'quadratic', r: res.k / (2 * G * area * area), diameterM: res.diameterM }
      }
      if (!positive(res.dropKpa) || !positive(res.atFlowLpm)) return `resistance ${link.id}: rated drop and flow must be above zero`
      const headM = (res.dropKpa * 1000) / (densityKgM3 * G)
      const q = res.atFlowLpm / 60000
      return { kind: 'quadratic', r: headM / (q * q), diameterM: null }
    }
    case 'pump': {
      const pump = link.pump
      if ('fixedFlowLpm' in pump) {
        if (!Number.isFinite(pump.fixedFlowLpm)) return `pump ${link.id}: fixed flow must be a number`
        return { kind: 'fixed-flow', flow: pump.fixedFlowLpm / 60000 }
      }
      const pts = pump.curve ?? []
      if (pts.length === 0 || pts.some(p => !Number.isFinite(p.flowLpm) || !Number.isFinite(p.headM) || p.flowLpm < 0)) {
        return `pump ${link.id}: the head curve needs points with flow ≥ 0 and a head`
      }
      const { c0, c1, c2 } = fitPumpCurve(pts)
      if (![c0, c1, c2].every(Number.isFinite)) return `pump ${link.id}: the head curve points do not define a curve`
      const maxFlow = Math.max(...pts.map(p => p.flowLpm)) / 60000
      const maxHead = Math.max(...pts.map(p => Math.abs(p.headM)), 1e-3)
      const sorted = [...pts].sort((a, b) => a.flowLpm - b.flowLpm)
      const designFlow = sorted[Math.floor((sorted.length - 1) / 2)]!.flowLpm / 60000 || maxFlow / 2
      const minSlope = (1e-3 * maxHead) / Math.max(maxFlow, 1e-6)
      // Real pump curves fall with flow. A quadratic through convex points can turn upwards; past its
      // lowest point (or past the last stated point when c2 > 0) the head is continued as a falling line,
      // and reverse flow always sees a line, so that the operating point is unique.
      const law: PumpCurveLaw = { kind: 'pump-curve', c0, c1, c2, qHigh: Number.POSITIVE_INFINITY, slopeHigh: -minSlope, slopeLow: Math.min(c1, -minSlope), minSlope, designFlow }
      if (c2 > 0) {
        const vertex = -c1 / (2 * c2)
        if (vertex < maxFlow) {
          law.qHigh = Math.max(vertex, 0)
          law.adjusted = `pump ${link.id}: the quadratic through its curve points turns upwards above ${(law.qHigh * 60000).toFixed(1)} L/min; continued as a falling line`
        } else {
          law.qHigh = maxFlow
          law.slopeHigh = Math.min(c1 + 2 * c2 * maxFlow, -minSlope)
        }
      }
      return law
    }
  }
}
