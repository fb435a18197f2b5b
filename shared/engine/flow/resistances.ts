// Loss coefficients for the paths inside parts and along hoses.
import type { ComponentType, HoseMaterial, Point3, Resistance } from '../../circuit'
import { bendK, craneFullyTurbulentFrictionFactor, EXIT_K, ROUGHNESS_M, SHARP_ENTRANCE_K } from '../physics'
import type { PortInfo } from '../model'

/**
 * Typical resistances used when a part has none of its own: order-of-magnitude figures from memory,
 * there so an unspecified part neither blocks flow nor vanishes. The report lists every part that
 * used one, so the fabricator can enter data-sheet values.
 */
export const DEFAULT_RESISTANCE: Partial<Record<ComponentType, Resistance>> = {
  engine: { dropKpa: 15, atFlowLpm: 100 },
  radiator: { dropKpa: 8, atFlowLpm: 100 },
  'heater-core': { dropKpa: 12, atFlowLpm: 10 },
  thermostat: { k: 3, diameterMm: 30 },
  'heater-valve': { k: 2, diameterMm: 16 },
}

/** Inline fittings: each port path gets half of Crane's tee-run figure (20·f_T) so a run through costs 20·f_T. */
const FITTING_TYPES = new Set<ComponentType>(['tee', 'reducer', 'bleed-valve', 'heater-valve', 'thermostat-housing', 'blanking-plug', 'drain', 'generic'])

/** A jiggle valve or bleed hole in a shut thermostat: a 3 mm sharp orifice, K = 1/Cd² with Cd ≈ 0.61 (from memory). */
export const THERMOSTAT_BLEED_HOLE = { k: 1 / (0.61 * 0.61), diameterMm: 3 }

export function roughnessFor(material: HoseMaterial): number {
  if (material === 'hard-line') return ROUGHNESS_M.hardLine
  if (material === 'silicone') return ROUGHNESS_M.siliconeHose
  return ROUGHNESS_M.rubberHose
}

/** K at bore d (m) of a resistance given at another bore or as a rated drop: same Δp at the same flow. */
export function kAtBore(r: Resistance, diameterM: number, densityKgM3: number): number {
  if ('k' in r) return r.k * (diameterM / (r.diameterMm / 1000)) ** 4
  const q = r.atFlowLpm / 60_000
  const v = q / ((Math.PI / 4) * diameterM * diameterM)
  return (2 * r.dropKpa * 1000) / (densityKgM3 * v * v)
}

/** Bore of a port path: the hose on it, else the spigot. */
export function portBoreM(p: PortInfo): number {
  return (p.joined ? p.joined.hose.hose.insideDiameterMm : p.port.spigotOdMm) / 1000
}

/**
 * K of the path from a part's centre to one of its ports, referred to the port bore. The part's own
 * resistance sits on its inlet paths (split in half over every path when no port is an inlet).
 */
/** f_T depends only on the bore and costs a Colebrook solve, and a circuit has a handful of bores. */
const fullyTurbulentByBore = new Map<number, number>()
function fullyTurbulent(diameterM: number): number {
  let f = fullyTurbulentByBore.get(diameterM)
  if (f === undefined) {
    f = craneFullyTurbulentFrictionFactor(diameterM)
    if (fullyTurbulentByBore.size > 10_000) fullyTurbulentByBore.clear()
    fullyTurbulentByBore.set(diameterM, f)
  }
  return f
}
const bend90ByBore = new Map<number, number>()
function bend90(diameterM: number): number {
  let k = bend90ByBore.get(diameterM)
  if (k === undefined) {
    k = bendK(diameterM, 90, HOSE_BEND_RADIUS_OVER_BORE)
    if (bend90ByBore.size > 10_000) bend90ByBore.clear()
    bend90ByBore.set(diameterM, k)
  }
  return k
}

export function portPathK(p: PortInfo, densityKgM3: number): { k: number; defaulted: boolean } {
  const type = p.comp.comp.type
  const d = portBoreM(p)
  const base = FITTING_TYPES.has(type)
    ? 10 * fullyTurbulent(d)
    : p.port.role === 'inlet' ? EXIT_K : SHARP_ENTRANCE_K
  const own = p.comp.comp.params.resistance
  const r = own ?? DEFAULT_RESISTANCE[type]
  if (!r) return { k: base, defaulted: false }
  const hasInlet = p.comp.ports.some((q) => q.port.role === 'inlet')
  if (hasInlet && p.port.role !== 'inlet') return { k: base, defaulted: false }
  const share = hasInlet ? 1 : 0.5
  return { k: base + share * kAtBore(r, d, densityKgM3), defaulted: !own }
}

/** Deflection at each interior route point, degrees. */
export function routeAngles(points: readonly Point3[]): number[] {
  const out: number[] = []
  for (let i = 1; i < points.length - 1; i++) {
    const a = points[i - 1]!, b = points[i]!, c = points[i + 1]!
    const ux = b.x - a.x, uy = b.y - a.y, uz = b.z - a.z
    const vx = c.x - b.x, vy = c.y - b.y, vz = c.z - b.z
    const nu = Math.sqrt(ux * ux + uy * uy + uz * uz)
    const nv = Math.sqrt(vx * vx + vy * vy + vz * vz)
    if (nu === 0 || nv === 0) continue
    const cos = (ux * vx + uy * vy + uz * vz) / (nu * nv)
    out.push((Math.acos(Math.min(1, Math.max(-1, cos))) * 180) / Math.PI)
  }
  return out
}

/** A hose bends gently; r/d = 3 is our assumption for a hose laid round a corner (common practice). */
export const HOSE_BEND_RADIUS_OVER_BORE = 3

/**
 * Bend K along a route, Crane TP-410 (physics bendK). Crane's n·90° rule is for bends of 90° and more;
 * below 90° we scale the 90° figure by angle/90 so a straight run costs nothing.
 */
export function routeBendK(points: readonly Point3[], diameterM: number): number {
  let k = 0
  for (const angle of routeAngles(points)) {
    if (angle < 1) continue
    k += angle >= 90
      ? bendK(diameterM, angle, HOSE_BEND_RADIUS_OVER_BORE)
      : (bend90(diameterM) * angle) / 90
  }
  return k
}
