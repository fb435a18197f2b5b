// Darcy friction factor and straight-pipe pressure drop (Darcy–Weisbach).
//
// Regimes:
//   Re < 2300          laminar, f = 64/Re exactly (Hagen–Poiseuille).
//   Re ≥ 4000          Colebrook–White (1939), 1/√f = −2·log10(ε/(3.7D) + 2.51/(Re·√f)), solved with
//                      Clamond's (2009) method, which reaches the exact root to machine precision in
//                      two steps (the same algorithm as fluids.friction.Clamond).
//   2300 ≤ Re < 4000   our blend: f = (1 − w)·64/Re + w·f_Colebrook(Re), with the cubic smoothstep
//                      w = s²(3 − 2s), s = (Re − 2300)/1700. It meets both ends with matching value and
//                      slope, so the network solver's Newton steps see a smooth curve. The transitional
//                      regime is not predictable in reality; this is a modelling choice (EPANET 2.2
//                      uses Dunlop's cubic interpolation over 2000–4000 instead).

export const LAMINAR_LIMIT_RE = 2300
export const TURBULENT_LIMIT_RE = 4000
const LN10 = Math.log(10)

export function laminarFrictionFactor(re: number): number {
  return 64 / re
}

/**
 * Colebrook–White friction factor (Darcy) solved exactly by Clamond's method.
 * `relativeRoughness` is ε/D. Valid for the turbulent range; callers below Re ≈ 2000 want the laminar law.
 */
export function colebrookFrictionFactor(re: number, relativeRoughness: number): number {
  // Clamond (2009), "Efficient resolution of the Colebrook equation", Ind. Eng. Chem. Res. 48, 3665.
  // Colebrook rewritten as F + ln(X1 + F) = X2 with F = ln(10)/(2√f); the two steps below are his
  // fourth-order iterations from the starting point F = X2 − 1/5.
  const x1 = (relativeRoughness * re * LN10) / 18.574 // 18.574 = 3.7 × 5.02
  const x2 = Math.log((re * LN10) / 5.02) // 5.02 = 2 × 2.51
  let f = x2 - 0.2
  for (let step = 0; step < 2; step++) {
    const x1f = x1 + f
    const x1f1 = 1 + x1f
    const e = (Math.log(x1f) + f - x2) / x1f1
    f = f - ((x1f1 + 0.5 * e) * e * x1f) / (x1f1 + e * (1 + e / 3))
  }
  return (LN10 / 2) ** 2 / (f * f)
}

/** Colebrook friction factor and its derivative df/dRe (implicit differentiation of Colebrook). */
function colebrookWithSlope(re: number, relativeRoughness: number): { f: number; dfdRe: number } {
  const f = colebrookFrictionFactor(re, relativeRoughness)
  const x = 1 / Math.sqrt(f)
  const u = relativeRoughness / 3.7 + (2.51 * x) / re
  const c = (2 * 2.51) / (LN10 * u * re)
  const dxdRe = (c * x) / (re * (1 + c))
  return { f, dfdRe: (-2 * dxdRe) / (x * x * x) }
}

/** Fully rough limit of Colebrook (von Kármán): 1/√f = −2·log10(ε/(3.7D)). */
export function fullyRoughFrictionFactor(relativeRoughness: number): number {
  if (!(relativeRoughness > 0)) throw new RangeError('a fully rough friction factor needs a roughness above zero')
  const s = -2 * Math.log10(relativeRoughness / 3.7)
  return 1 / (s * s)
}

export interface FrictionPoint {
  f: number
  /** df/dRe */
  dfdRe: number
  regime: 'laminar' | 'transitional' | 'turbulent'
}

/** Darcy friction factor at any Reynolds number > 0 with its slope, using the regimes above. */
export function frictionFactorWithSlope(re: number, relativeRoughness: number): FrictionPoint {
  if (!(re > 0)) throw new RangeError(`Reynolds number must be positive, got ${re}`)
  if (re < LAMINAR_LIMIT_RE) return { f: 64 / re, dfdRe: -64 / (re * re), regime: 'laminar' }
  const turbulent = colebrookWithSlope(re, relativeRoughness)
  if (re >= TURBULENT_LIMIT_RE) return { ...turbulent, regime: 'turbulent' }
  const span = TURBULENT_LIMIT_RE - LAMINAR_LIMIT_RE
  const s = (re - LAMINAR_LIMIT_RE) / span
  const w = s * s * (3 - 2 * s)
  const dwdRe = (6 * s * (1 - s)) / span
  const fl = 64 / re
  const dfl = -64 / (re * re)
  return {
    f: (1 - w) * fl + w * turbulent.f,
    dfdRe: (1 - w) * dfl + w * turbulent.dfdRe + dwdRe * (turbulent.f - fl),
    regime: 'transitional',
  }
}

/** Darcy friction factor for a Reynolds number and relative roughness ε/D. */
export function darcyFrictionFactor(re: number, relativeRoughness: number): number {
  return frictionFactorWithSlope(re, relativeRoughness).f
}

/** Mean velocity, m/s, for a flow in L/min through a bore in m. */
export function velocityFromFlow(flowLpm: number, diameterM: number): number {
  const area = (Math.PI / 4) * diameterM * diameterM
  return flowLpm / 60000 / area
}

export function reynoldsNumber(velocityMS: number, diameterM: number, densityKgM3: number, viscosityPaS: number): number {
  return (densityKgM3 * Math.abs(velocityMS) * diameterM) / viscosityPaS
}

export interface PipeFlowFluid {
  densityKgM3: number
  viscosityPaS: number
}

export interface StraightPipeDrop {
  velocityMS: number
  reynolds: number
  /** null at zero flow */
  frictionFactor: number | null
  /** Pa per metre, positive in the flow direction */
  pressureDropPaPerM: number
  /** ρv²/2, Pa: multiply by a loss coefficient K for a fitting */
  velocityPressurePa: number
}

/** Darcy–Weisbach: Δp/L = f·(1/D)·ρv²/2. */
export function darcyPressureDropPerMetre(flowLpm: number, diameterM: number, roughnessM: number, fluid: PipeFlowFluid): StraightPipeDrop {
  const v = velocityFromFlow(flowLpm, diameterM)
  const re = reynoldsNumber(v, diameterM, fluid.densityKgM3, fluid.viscosityPaS)
  const q = 0.5 * fluid.densityKgM3 * v * v
  if (re === 0) return { velocityMS: 0, reynolds: 0, frictionFactor: null, pressureDropPaPerM: 0, velocityPressurePa: 0 }
  const f = darcyFrictionFactor(re, roughnessM / diameterM)
  return { velocityMS: v, reynolds: re, frictionFactor: f, pressureDropPaPerM: Math.sign(v) * (f / diameterM) * q, velocityPressurePa: q }
}
