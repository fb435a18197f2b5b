// Fuel properties and the trade's fuel units. Every conversion factor is an exact definition
// (1 lb = 0.45359237 kg, 1 US gal = 3.785411784 L, 1 hp = 550 ft·lbf/s); the fuel properties are
// typical figures, each with its source beside it.
import { KG_PER_POUND, LITRES_PER_US_GALLON, MM_PER_INCH, NEWTONS_PER_POUND_FORCE } from './units'

export type FuelName = 'petrol' | 'e5' | 'e10' | 'e85'

export interface FuelProperties {
  name: string
  /** share of ethanol by volume, % */
  ethanolPercent: number
  /** kg/L at 15 °C */
  densityKgL: number
  /** dynamic viscosity at 20 °C, Pa·s */
  viscosityPaS: number
  source: string
}

/**
 * Petrol: 0.740 kg/L at 15 °C, the middle of the EN 228 limits of 720–775 kg/m³ at 15 °C (the limits as
 * published in EN 228 test summaries; the typical 0.74 is common practice). Ethanol: 0.789 kg/L
 * (handbook figure, 20 °C; from memory, about 0.79 in published fuel tables). Blends by ideal volume
 * mixing of the two. Viscosity at 20 °C from memory: petrol about 0.45 mPa·s (0.6 mm²/s), ethanol
 * 1.2 mPa·s; blends are a rough figure, and only the Reynolds number of the line estimate uses them.
 */
export const PETROL_DENSITY_KG_L = 0.74
export const ETHANOL_DENSITY_KG_L = 0.789
export const PETROL_DENSITY_SOURCE = 'petrol 0.740 kg/L at 15 °C (middle of the EN 228 range 0.720–0.775; common practice)'

function blend(name: string, ethanolPercent: number, viscosityMPaS: number): FuelProperties {
  const x = ethanolPercent / 100
  return {
    name,
    ethanolPercent,
    densityKgL: Math.round(((1 - x) * PETROL_DENSITY_KG_L + x * ETHANOL_DENSITY_KG_L) * 1000) / 1000,
    viscosityPaS: viscosityMPaS / 1000,
    source: ethanolPercent === 0
      ? PETROL_DENSITY_SOURCE
      : `${ethanolPercent} % ethanol (0.789 kg/L) in petrol (0.740 kg/L at 15 °C), ideal volume mixing`,
  }
}

export const FUEL_PROPERTIES: Record<FuelName, FuelProperties> = {
  petrol: blend('petrol (no ethanol)', 0, 0.45),
  e5: blend('petrol E5', 5, 0.47),
  e10: blend('petrol E10', 10, 0.5),
  e85: blend('E85', 85, 1.0),
}

/** The fuel as a circuit states it: the table's figures, or the workshop's own density. */
export function fuelProperties(name: FuelName, densityKgL?: number): FuelProperties {
  const base = FUEL_PROPERTIES[name]
  if (densityKgL === undefined) return base
  return { ...base, densityKgL, source: `${densityKgL} kg/L as entered for this circuit` }
}

/** 1 hp (mechanical) = 550 ft·lbf/s = 745.69987158227… W, from the exact foot and pound-force. */
export const WATTS_PER_HORSEPOWER = 550 * (12 * MM_PER_INCH / 1000) * NEWTONS_PER_POUND_FORCE
export const kwToHp = (kw: number): number => (kw * 1000) / WATTS_PER_HORSEPOWER
export const hpToKw = (hp: number): number => (hp * WATTS_PER_HORSEPOWER) / 1000

/** 1 lb/(hp·h) = 453.59237 g per 0.74569987… kWh = 608.277… g/kWh. */
export const G_PER_KWH_PER_LB_PER_HP_H = (KG_PER_POUND * 1000) / (WATTS_PER_HORSEPOWER / 1000)
export const bsfcToLbPerHpH = (gPerKwh: number): number => gPerKwh / G_PER_KWH_PER_LB_PER_HP_H
export const bsfcToGPerKwh = (lbPerHpH: number): number => lbPerHpH * G_PER_KWH_PER_LB_PER_HP_H

/** Mass flow in lb/h → volume flow in cc/min for a fuel of density ρ kg/L (= g/cc): lb/h × 453.59237 / 60 / ρ. */
export const lbPerHourToCcPerMin = (lbPerHour: number, densityKgL: number): number => (lbPerHour * KG_PER_POUND * 1000) / 60 / densityKgL
export const ccPerMinToLbPerHour = (ccPerMin: number, densityKgL: number): number => (ccPerMin * densityKgL * 60) / (KG_PER_POUND * 1000)

export const litresPerHourToCcPerMin = (lph: number): number => (lph * 1000) / 60
export const ccPerMinToLitresPerHour = (ccMin: number): number => (ccMin * 60) / 1000
export const litresPerHourToLpm = (lph: number): number => lph / 60
export const litresPerHourToUsGallonsPerHour = (lph: number): number => lph / LITRES_PER_US_GALLON
export const usGallonsPerHourToLitresPerHour = (gph: number): number => gph * LITRES_PER_US_GALLON

/**
 * An injector's flow at another pressure across it: Q₂ = Q₁·√(Δp₂/Δp₁) (flow through a fixed orifice
 * goes with the square root of the drop; common practice, check-values §7).
 */
export function injectorFlowAt(ratedFlow: number, ratedDeltaPKpa: number, actualDeltaPKpa: number): number {
  if (!(ratedDeltaPKpa > 0)) throw new Error(`rated pressure must be above 0 kPa, got ${ratedDeltaPKpa}`)
  return ratedFlow * Math.sqrt(Math.max(0, actualDeltaPKpa) / ratedDeltaPKpa)
}

/**
 * Flow each injector must deliver, the trade's sizing rule (common practice, check-values §7):
 * power × BSFC / (injectors × duty). Units follow the inputs: hp and lb/(hp·h) give lb/h; kW and
 * g/kWh give g/h.
 */
export function injectorFlowNeeded(power: number, bsfc: number, injectors: number, maxDuty: number): number {
  if (!(injectors > 0) || !(maxDuty > 0)) throw new Error('injectors and duty must be above 0')
  return (power * bsfc) / (injectors * maxDuty)
}
