// Liquid water density and viscosity for coolant temperatures (0–150 °C).
//
// Density: IAPWS-IF97 region 1 (see if97-region1.ts). Above the normal boiling point a liquid coolant
// is only possible under pressure, so when the caller gives no pressure we evaluate the liquid at
// max(1 atm, ps(T)) — saturated liquid above 99.97 °C. The Kell (1975) equation in its ITS-90 recast
// is kept as a named cross-check.
//
// Viscosity: IAPWS R12-08, "Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary
// Water Substance", μ = μ0(T)·μ1(T, ρ)·μ2. The critical enhancement μ2 is set to 1: the release
// limits μ2 ≠ 1 to a small region around the critical point (647 K, 322 kg/m³), far from coolant
// states, where it differs from 1 by well under 0.01 %.

import { region1 } from './if97-region1'
import { saturationPressureKpa } from './if97-region4'
import { STANDARD_ATMOSPHERE_KPA } from './units'

export const WATER_MIN_TEMPERATURE_C = 0
export const WATER_MAX_TEMPERATURE_C = 150

function assertWaterRange(tempC: number): void {
  if (!(tempC >= WATER_MIN_TEMPERATURE_C - 1e-9 && tempC <= WATER_MAX_TEMPERATURE_C + 1e-9)) {
    throw new RangeError(`water properties cover ${WATER_MIN_TEMPERATURE_C}–${WATER_MAX_TEMPERATURE_C} °C, got ${tempC}`)
  }
}

/** The pressure at which liquid properties are evaluated when none is given: 1 atm, or ps(T) if higher. */
export function defaultLiquidPressureKpaAbs(tempC: number): number {
  return Math.max(STANDARD_ATMOSPHERE_KPA, saturationPressureKpa(tempC))
}

/** Liquid water density, kg/m³ (IAPWS-IF97 region 1). */
export function waterDensity(tempC: number, pressureKpaAbs?: number): number {
  assertWaterRange(tempC)
  const pKpa = Math.max(pressureKpaAbs ?? 0, defaultLiquidPressureKpaAbs(tempC))
  return 1 / region1(tempC + 273.15, pKpa / 1000).specificVolume
}

/** Liquid water isobaric heat capacity, J/(kg·K) (IAPWS-IF97 region 1). */
export function waterHeatCapacity(tempC: number, pressureKpaAbs?: number): number {
  assertWaterRange(tempC)
  const pKpa = Math.max(pressureKpaAbs ?? 0, defaultLiquidPressureKpaAbs(tempC))
  return region1(tempC + 273.15, pKpa / 1000).isobaricHeatCapacity * 1000
}

/**
 * Kell's density equation for air-free water at 1 atm, ITS-90 recast (Bettin & Spieweck 1990),
 * t in °C. Stated range 0–150 °C; above 100 °C it describes superheated liquid at 1 atm.
 */
export function waterDensityKell(tempC: number): number {
  const t = tempC
  const num = 999.83952 + t * (16.945176 + t * (-7.9870401e-3 + t * (-46.170461e-6 + t * (105.56302e-9 + t * -280.54253e-12))))
  return num / (1 + 16.87985e-3 * t)
}

// IAPWS R12-08 reference constants
const T_CRIT_K = 647.096
const RHO_CRIT = 322
const H0 = [1.67752, 2.20462, 0.6366564, -0.241605] as const
// Table 2 of R12-08: H_ij for i = 0…5 (powers of 1/T̄ − 1) and j = 0…6 (powers of ρ̄ − 1)
const H1_TERMS: ReadonlyArray<readonly [number, number, number]> = [
  [0, 0, 5.20094e-1], [1, 0, 8.50895e-2], [2, 0, -1.08374], [3, 0, -2.89555e-1],
  [0, 1, 2.22531e-1], [1, 1, 9.99115e-1], [2, 1, 1.88797], [3, 1, 1.26613], [5, 1, 1.20573e-1],
  [0, 2, -2.81378e-1], [1, 2, -9.06851e-1], [2, 2, -7.72479e-1], [3, 2, -4.89837e-1], [4, 2, -2.57040e-1],
  [0, 3, 1.61913e-1], [1, 3, 2.57399e-1],
  [0, 4, -3.25372e-2], [3, 4, 6.98452e-2],
  [4, 5, 8.72102e-3],
  [3, 6, -4.35673e-3], [5, 6, -5.93264e-4],
]

/** IAPWS 2008 viscosity in Pa·s from temperature (K) and density (kg/m³), with μ2 = 1. */
export function waterViscosityIapws2008(temperatureK: number, densityKgM3: number): number {
  const tr = temperatureK / T_CRIT_K
  const dr = densityKgM3 / RHO_CRIT
  let sum0 = 0
  for (let i = 0; i < H0.length; i++) sum0 += H0[i]! / tr ** i
  const mu0 = (100 * Math.sqrt(tr)) / sum0
  const x = 1 / tr - 1
  const y = dr - 1
  let sum1 = 0
  for (const [i, j, h] of H1_TERMS) sum1 += h * x ** i * y ** j
  const mu1 = Math.exp(dr * sum1)
  return mu0 * mu1 * 1e-6 // μ* = 1e-6 Pa·s
}

/** Liquid water viscosity, Pa·s, at the IF97 density for the same state. */
export function waterViscosity(tempC: number, pressureKpaAbs?: number): number {
  return waterViscosityIapws2008(tempC + 273.15, waterDensity(tempC, pressureKpaAbs))
}
