// Minor-loss coefficients K (Δp = K·ρv²/2) for hose-system fittings, and default wall roughness.
//
// Method: Crane Technical Paper 410, "Flow of Fluids Through Valves, Fittings, and Pipe": K = (L/D)·f_T,
// where f_T is the fully turbulent friction factor for the line size. Crane tabulates f_T for clean
// commercial steel; we compute it as fluids.ft_Crane does (fluids 1.0.22, fluids/friction.py), the
// Colebrook factor at Re = 7.5e6·D/m with Farshad's bare-steel roughness ε = 3.4126825352925e-5·D^(−1.0112),
// which reproduces Crane's rounded table. Crane's L/D values were measured on steel fittings, so the
// Crane f_T is also the default for hose fittings; `{ roughnessM }` switches to the fully rough
// Colebrook limit for the actual wall instead.

import { colebrookFrictionFactor, fullyRoughFrictionFactor } from './friction'

/** Crane's fully turbulent friction factor f_T for a bore D in m (fluids.ft_Crane). */
export function craneFullyTurbulentFrictionFactor(diameterM: number): number {
  return colebrookFrictionFactor(7.5e6 * diameterM, 3.4126825352925e-5 * diameterM ** -1.0112)
}

/**
 * Wall roughness defaults, m. Common practice figures; the sources vary by a factor of several for
 * rubber, and at hose Reynolds numbers (1e4–1e5) any of them behaves almost as a smooth wall.
 */
export const ROUGHNESS_M = {
  /** moulded rubber (EPDM) coolant hose: ~0.01 mm, common practice (from memory) */
  rubberHose: 1.0e-5,
  /** silicone hose, smooth bore: ~0.005 mm, common practice (from memory) */
  siliconeHose: 5.0e-6,
  /** drawn tube, aluminium or stainless hard line: 0.0015 mm (Moody's drawn-tubing figure, from memory) */
  hardLine: 1.5e-6,
  /** commercial steel pipe: 0.045 mm (Moody 1944, from memory) */
  steelPipe: 4.5e-5,
} as const

/**
 * Crane TP-410 A-29: L/D of 90° pipe bends by bend radius / bore (r/d). r/d 1.5 → 14 is confirmed
 * (Eng-Tips quotation of A-29); r/d 1…10 are from memory of the chart; 12…20 as listed in fluids'
 * bend_rounded_Crane table (fluids 1.0.22, fluids/fittings.py). Our tests compare all rows with fluids.
 */
export const CRANE_BEND_L_OVER_D: ReadonlyArray<readonly [rOverD: number, lOverD: number]> = [
  [1, 20], [1.5, 14], [2, 12], [3, 12], [4, 14], [6, 17], [8, 24], [10, 30], [12, 34], [14, 38], [16, 42], [20, 50],
]

export type Fitting =
  /** smooth bend (moulded hose bend, bent tube), angle in degrees, centre-line radius / bore */
  | { kind: 'bend'; angleDeg: number; radiusOverDiameter: number }
  /** short-radius threaded/cast elbow: Crane 90° standard elbow 30·f_T, 45° elbow 16·f_T */
  | { kind: 'elbow'; angleDeg: 45 | 90 }
  /** tee, flow straight through the run: 20·f_T */
  | { kind: 'tee-run' }
  /** tee, flow turning through the branch: 60·f_T */
  | { kind: 'tee-branch' }
  /** square-edged inlet from a tank or header: 0.5 */
  | { kind: 'entrance-sharp' }
  /** discharge into a tank or large header: 1.0 */
  | { kind: 'exit' }
  /** sudden enlargement to `largeDiameterM` (Borda–Carnot), K on the small-bore velocity */
  | { kind: 'expansion'; largeDiameterM: number }
  /** sudden reduction from `largeDiameterM`, K on the small-bore velocity */
  | { kind: 'contraction'; largeDiameterM: number; method?: 'crane' | 'rennels' }
  /** a K already known from a data sheet */
  | { kind: 'fixed'; k: number }

export interface FittingOptions {
  /** how f_T is found: Crane's steel-pipe table (default) or the fully rough limit for this wall */
  fullyTurbulentBasis?: 'crane' | { roughnessM: number }
}

function fullyTurbulentFactor(diameterM: number, options: FittingOptions): number {
  const basis = options.fullyTurbulentBasis ?? 'crane'
  if (basis === 'crane') return craneFullyTurbulentFrictionFactor(diameterM)
  return fullyRoughFrictionFactor(basis.roughnessM / diameterM)
}

/** L/D of a 90° bend at r/d, linear between the Crane A-29 rows, r/d clamped to 1…20. */
export function craneBendLOverD(radiusOverDiameter: number): number {
  const table = CRANE_BEND_L_OVER_D
  const r = Math.min(Math.max(radiusOverDiameter, table[0]![0]), table[table.length - 1]![0])
  for (let k = 1; k < table.length; k++) {
    const [r1, l1] = table[k]!
    if (r <= r1) {
      const [r0, l0] = table[k - 1]!
      return l0 + ((l1 - l0) * (r - r0)) / (r1 - r0)
    }
  }
  return table[table.length - 1]![1]
}

/**
 * Bend K. For angles other than 90° we use Crane's rule for n 90° bends, with n = angle/90:
 * K = (n − 1)·(0.25·π·f_T·r/d + 0.5·K90) + K90 (as fluids.bend_rounded_Crane applies it to any angle).
 */
export function bendK(diameterM: number, angleDeg: number, radiusOverDiameter: number, options: FittingOptions = {}): number {
  const ft = fullyTurbulentFactor(diameterM, options)
  const r = Math.min(Math.max(radiusOverDiameter, 1), 20)
  const k90 = craneBendLOverD(r) * ft
  const n = angleDeg / 90
  return (n - 1) * (0.25 * Math.PI * ft * r + 0.5 * k90) + k90
}

/** Borda–Carnot sudden expansion, K on the small-bore velocity: (1 − β²)², β = d/D. */
export function suddenExpansionK(smallDiameterM: number, largeDiameterM: number): number {
  const beta = smallDiameterM / largeDiameterM
  return (1 - beta * beta) ** 2
}

/** Sudden contraction, K on the small-bore velocity. Crane: 0.5·(1 − β²). Rennels (2012): see below. */
export function suddenContractionK(largeDiameterM: number, smallDiameterM: number, method: 'crane' | 'rennels' = 'crane'): number {
  const beta = smallDiameterM / largeDiameterM
  if (method === 'crane') return 0.5 * (1 - beta * beta)
  // Rennels & Hudson, "Pipe Flow" (2012): K = 0.0696(1 − β⁵)λ² + (λ − 1)², λ = 1 + 0.622(1 − 0.215β² − 0.785β⁵)
  const b5 = beta ** 5
  const lambda = 1 + 0.622 * (1 - 0.215 * beta * beta - 0.785 * b5)
  return 0.0696 * (1 - b5) * lambda * lambda + (lambda - 1) ** 2
}

export const SHARP_ENTRANCE_K = 0.5
export const EXIT_K = 1.0

/** Loss coefficient of a fitting on a bore `diameterM`, referred to that bore's velocity. */
export function fittingK(fitting: Fitting, diameterM: number, options: FittingOptions = {}): number {
  switch (fitting.kind) {
    case 'bend': return bendK(diameterM, fitting.angleDeg, fitting.radiusOverDiameter, options)
    case 'elbow': return (fitting.angleDeg === 45 ? 16 : 30) * fullyTurbulentFactor(diameterM, options)
    case 'tee-run': return 20 * fullyTurbulentFactor(diameterM, options)
    case 'tee-branch': return 60 * fullyTurbulentFactor(diameterM, options)
    case 'entrance-sharp': return SHARP_ENTRANCE_K
    case 'exit': return EXIT_K
    case 'expansion': return fitting.largeDiameterM > diameterM ? suddenExpansionK(diameterM, fitting.largeDiameterM) : 0
    case 'contraction': return fitting.largeDiameterM > diameterM ? suddenContractionK(fitting.largeDiameterM, diameterM, fitting.method) : 0
    case 'fixed': return fitting.k
  }
}

/** Sum of K for a list of fittings on one bore (what NetworkLink 'pipe' takes as minorK). */
export function totalMinorK(fittings: readonly Fitting[], diameterM: number, options: FittingOptions = {}): number {
  let sum = 0
  for (const f of fittings) sum += fittingK(f, diameterM, options)
  return sum
}
