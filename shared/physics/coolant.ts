// Coolant properties for the hydraulic calculation and the boil/freeze margins.

import { normaliseMix, waterMoleFraction } from './glycol-mix'
import { MELINDER_MAX_MASS_PERCENT, MELINDER_MAX_TEMPERATURE_C, melinderDensity, melinderHeatCapacity, melinderViscosity } from './glycol-melinder'
import { freezePoint } from './glycol-freeze'
import { saturationTemperatureC } from './if97-region4'
import { STANDARD_ATMOSPHERE_KPA } from './units'
import { WATER_MAX_TEMPERATURE_C, WATER_MIN_TEMPERATURE_C, waterDensity, waterHeatCapacity, waterViscosity } from './water'
import type { CoolantMix, FluidState } from './types'

export const WATER_PROPERTIES_SOURCE = 'IAPWS-IF97 region 1 density; IAPWS 2008 viscosity (critical enhancement μ2 = 1)'
const GLYCOL_SOURCE: Record<'ethylene-glycol' | 'propylene-glycol', string> = {
  'ethylene-glycol': 'Melinder (2010) aqueous ethylene glycol polynomial, mass basis (as CoolProp INCOMP::MEG)',
  'propylene-glycol': 'Melinder (2010) aqueous propylene glycol polynomial, mass basis (as CoolProp INCOMP::MPG)',
}

/**
 * Density, viscosity and heat capacity of a coolant at a temperature (°C).
 * Water: 0–150 °C, at `pressureKpaAbs` or, if not given, at 1 atm / saturation (see water.ts).
 * Glycol mixes: Melinder's fit, valid from the mix's freezing point to 100 °C and 0–60 mass %;
 * above 100 °C (to 150 °C) the polynomial is extrapolated and a note says so.
 * Temperatures outside the range are clamped to it, with a note; nothing here throws for a valid mix.
 */
export function coolantProperties(mix: CoolantMix, tempC: number, pressureKpaAbs?: number): FluidState {
  const m = normaliseMix(mix)
  const notes = [...m.notes]
  if (m.fluid === 'water' || m.volumePercent === 0) {
    const t = clampTemperature(tempC, WATER_MIN_TEMPERATURE_C, WATER_MAX_TEMPERATURE_C, notes)
    return {
      densityKgM3: waterDensity(t, pressureKpaAbs),
      viscosityPaS: waterViscosity(t, pressureKpaAbs),
      heatCapacityJKgK: waterHeatCapacity(t, pressureKpaAbs),
      source: WATER_PROPERTIES_SOURCE,
      notes,
    }
  }
  const freeze = freezePoint(mix).tempC
  const t = clampTemperature(tempC, freeze, WATER_MAX_TEMPERATURE_C, notes)
  if (t > MELINDER_MAX_TEMPERATURE_C) {
    notes.push(`above ${MELINDER_MAX_TEMPERATURE_C} °C the glycol properties are extrapolated from the fit`)
  }
  if (m.massPercent > MELINDER_MAX_MASS_PERCENT) {
    notes.push(`${m.massPercent.toFixed(1)} mass % is beyond the fit's ${MELINDER_MAX_MASS_PERCENT} %: extrapolated`)
  }
  return {
    densityKgM3: melinderDensity(m.fluid, m.massPercent, t),
    viscosityPaS: melinderViscosity(m.fluid, m.massPercent, t),
    heatCapacityJKgK: melinderHeatCapacity(m.fluid, m.massPercent, t),
    source: GLYCOL_SOURCE[m.fluid],
    notes,
  }
}

function clampTemperature(tempC: number, min: number, max: number, notes: string[]): number {
  if (!Number.isFinite(tempC)) {
    notes.push(`temperature ${tempC} is not a number; ${min.toFixed(1)} °C used`)
    return min
  }
  if (tempC < min) {
    notes.push(`${tempC} °C is below the range (${min.toFixed(1)} °C, the freezing point for a mix); ${min.toFixed(1)} °C used`)
    return min
  }
  if (tempC > max) {
    notes.push(`${tempC} °C is above the ${max} °C the properties cover; ${max} °C used`)
    return max
  }
  return tempC
}

export interface BoilingPoint {
  tempC: number
  /** absolute pressure in the system, kPa */
  pressureKpaAbs: number
  /** mole fraction of water used in Raoult's law (1 for water) */
  waterMoleFraction: number
  source: string
  clamped: boolean
  notes: string[]
}

/**
 * Boiling point of a coolant under a pressure cap.
 * System pressure = ambient (default 1 standard atmosphere) + cap gauge pressure. Water boils at the
 * IAPWS-IF97 saturation temperature Ts(p). For a glycol mix the glycol is treated as non-volatile and
 * the water's partial pressure follows Raoult's law, x_w·ps(T) = p, so T = Ts(p / x_w).
 * Raoult's law ignores the mix's non-ideality; it is good to about ±1–2 K for 50 % glycol.
 */
export function boilingPoint(mix: CoolantMix, capGaugeKpa: number, ambientKpaAbs = STANDARD_ATMOSPHERE_KPA): BoilingPoint {
  const m = normaliseMix(mix)
  const notes = [...m.notes]
  const gauge = Number.isFinite(capGaugeKpa) && capGaugeKpa > 0 ? capGaugeKpa : 0
  if (gauge !== capGaugeKpa) notes.push(`cap pressure ${capGaugeKpa} kPa is not a positive gauge pressure; 0 kPa used`)
  const pressureKpaAbs = ambientKpaAbs + gauge
  const xw = m.fluid === 'water' ? 1 : waterMoleFraction(m.fluid, m.massPercent)
  return {
    tempC: saturationTemperatureC(pressureKpaAbs / xw),
    pressureKpaAbs,
    waterMoleFraction: xw,
    source: m.fluid === 'water'
      ? 'IAPWS-IF97 region 4 saturation temperature'
      : "IAPWS-IF97 region 4 saturation temperature with Raoult's law on the water mole fraction",
    clamped: m.clamped,
    notes,
  }
}

/** Boiling point of a coolant under a cap rated `capGaugeKpa` (gauge), °C. */
export function boilingPointC(mix: CoolantMix, capGaugeKpa: number): number {
  return boilingPoint(mix, capGaugeKpa).tempC
}
