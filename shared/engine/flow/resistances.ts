// Loss coefficients for the paths inside parts and along hoses.
import type { ComponentType, HoseMaterial, Point3, Resistance } from '../../circuit'
import { bendK, craneFullyTurbulentFrictionFactor, EXIT_K, ROUGHNESS_M, SHARP_ENTRANCE_K } from '../physics'
import type { PortInfo } from '../model'

// local copies: a re-exported binding can cost a getter call per use in some module loaders
const EXIT = EXIT_K
const SHARP_ENTRANCE = SHARP_ENTRANCE_K
const RUBBER = ROUGHNESS_M.rubberHose
const SILICONE = ROUGHNESS_M.siliconeHose
const HARD_LINE = ROUGHNESS_M.hardLine

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
  if (material === 'hard-line') return HARD_LINE
  if (material === 'silicone') return SILICONE
  return RUBBER
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
  return (p.joined ? p.joined.hose.insideDiameterMm : p.port.spigotOdMm) / 1000
}

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

/**
 * K of the path from a part's centre to one of its ports, referred to the port bore. The part's own
 * resistance sits on its inlet paths (split in half over every path when no port is an inlet).
 */
export function portPathK(p: PortInfo, densityKgM3: number): { k: number; defaulted: boolean } {
  const type = p.comp.comp.type
  const d = portBoreM(p)
  const base = FITTING_TYPES.has(type)
    ? 10 * fullyTurbulent(d)
    : p.port.role === 'inlet' ? EXIT : SHARP_ENTRANCE
  const own = p.comp.comp.params.resistance
  const r = own ?? DEFAULT_RESISTANCE[type]
  if (!r) return { k: base, defaulted: false }
  const hasInlet = p.comp.ports.some((q) => q.port.role === 'inlet')
  if (hasInlet && p.port.role !== 'inlet') return { k: base, defaulted: false }
  const share = hasInlet ? 1 : 0.5
  return { k: base + share * kAtBore(r, d, densityKgM3), defaulted: !own }
}

/** The turn at b between a→b and b→c, degrees; NaN when two points coincide. */
function deflectionDeg(a: Point3, b: Point3, c: Point3): number {
  const ux = b.x - a.x, uy = b.y - a.y, uz = b.z - a.z
  const vx = c.x - b.x, vy = c.y - b.y, vz = c.z - b.z
  const nu = Math.sqrt(ux * ux + uy * uy + uz * uz)
  const nv = Math.sqrt(vx * vx + vy * vy + vz * vz)
  if (nu === 0 || nv === 0) return Number.NaN
  const cos = (ux * vx + uy * vy + uz * vz) / (nu * nv)
  return (Math.acos(Math.min(1, Math.max(-1, cos))) * 180) / Math.PI
}

/** A hose bends gently; r/d = 3 is our assumption for a hose laid round a corner (common practice). */
export const HOSE_BEND_RADIUS_OVER_BORE = 3

/**
 * Bend K along a route, Crane TP-410 (physics bendK). Crane's n·90° rule is for bends of 90° and more;
 * below 90° we scale the 90° figure by angle/90 so a straight run costs nothing.
 */
export function routeBendK(from: Point3, route: readonly Point3[], to: Point3, diameterM: number): number {
  let k = 0
  for (let i = 0; i < route.length; i++) {
    const angle = deflectionDeg(i === 0 ? from : route[i - 1]!, route[i]!, i === route.length - 1 ? to : route[i + 1]!)
    if (!(angle >= 1)) continue // also two points on top of each other
    const bend = bendByBore(diameterM)
    k += angle >= 90 ? bend.k90 + (angle / 90 - 1) * bend.perExtra90 : (bend.k90 * angle) / 90
  }
  return k
}

/**
 * Crane's n·90° rule is linear in the angle: K(θ) = K90 + (θ/90 − 1)·(K(180°) − K90). The two values
 * depend only on the bore, and a circuit has a handful of bores, so they are kept per bore.
 */
const bendsByBore = new Map<number, { k90: number; perExtra90: number }>()
function bendByBore(diameterM: number): { k90: number; perExtra90: number } {
  let bend = bendsByBore.get(diameterM)
  if (bend === undefined) {
    const k90 = bendK(diameterM, 90, HOSE_BEND_RADIUS_OVER_BORE)
    bend = { k90, perExtra90: bendK(diameterM, 180, HOSE_BEND_RADIUS_OVER_BORE) - k90 }
    if (bendsByBore.size > 10_000) bendsByBore.clear()
    bendsByBore.set(diameterM, bend)
  }
  return bend
}
