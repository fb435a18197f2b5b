// Glycol–water mixes as the workshop states them (percent of concentrate by volume) and the
// conversions to the mass and mole bases the property formulations use.

import type { CoolantMix } from './types'

export type Glycol = 'ethylene-glycol' | 'propylene-glycol'

/**
 * Pure-liquid densities at 20 °C, kg/m³, used only to turn volume % into mass %.
 * Water 998.2: IAPWS-95 gives 998.207 at 20 °C, 1 atm. Ethylene glycol 1113 and propylene glycol 1036:
 * handbook values for the pure liquids at 20 °C (from memory; CRC-type tables list 1.1135 and 1.0361 g/cm³).
 * Mixing by volume assumes ideal volumes (no contraction): the 0.5–1 % contraction of real mixes
 * moves the mass % by a few tenths, below the spread between freeze-point tables.
 */
export const PURE_DENSITY_20C = { water: 998.2, 'ethylene-glycol': 1113, 'propylene-glycol': 1036 } as const

/**
 * Molar masses, g/mol, from IUPAC standard atomic weights (C 12.011, H 1.008, O 15.999):
 * water H2O 18.015, ethylene glycol C2H6O2 62.068, propylene glycol C3H8O2 76.094
 * (the abridged atomic weights sum to 76.095; 76.094 is the commonly listed value, from memory).
 */
export const MOLAR_MASS = { water: 18.015, 'ethylene-glycol': 62.068, 'propylene-glycol': 76.094 } as const

/** Upper end of the concentration range the tables and fits support, volume %. */
export const MAX_GLYCOL_VOLUME_PERCENT = 60

/** Volume % of concentrate → mass % of glycol (ideal mixing at 20 °C). */
export function volumeToMassPercent(glycol: Glycol, volumePercent: number): number {
  const phi = volumePercent / 100
  const g = phi * PURE_DENSITY_20C[glycol]
  const w = (1 - phi) * PURE_DENSITY_20C.water
  return g + w === 0 ? 0 : (100 * g) / (g + w)
}

/** Mass % of glycol → volume % of concentrate (ideal mixing at 20 °C). */
export function massToVolumePercent(glycol: Glycol, massPercent: number): number {
  const w = massPercent / 100
  const g = w / PURE_DENSITY_20C[glycol]
  const water = (1 - w) / PURE_DENSITY_20C.water
  return g + water === 0 ? 0 : (100 * g) / (g + water)
}

/** Mole fraction of water in a glycol–water mix given by mass % of glycol. */
export function waterMoleFraction(glycol: Glycol, massPercent: number): number {
  const nGlycol = massPercent / MOLAR_MASS[glycol]
  const nWater = (100 - massPercent) / MOLAR_MASS.water
  return nWater / (nWater + nGlycol)
}

export interface NormalisedMix {
  fluid: CoolantMix['fluid']
  /** volume % actually used, after clamping */
  volumePercent: number
  massPercent: number
  /** whether the stated percentage was outside 0…MAX_GLYCOL_VOLUME_PERCENT and was clamped */
  clamped: boolean
  notes: string[]
}

/** Validates and clamps a mix; water always comes back as 0 %. */
export function normaliseMix(mix: CoolantMix): NormalisedMix {
  if (mix.fluid === 'water') return { fluid: 'water', volumePercent: 0, massPercent: 0, clamped: false, notes: [] }
  const stated = mix.percentByVolume
  const notes: string[] = []
  let volumePercent = stated
  let clamped = false
  if (!Number.isFinite(stated) || stated < 0) {
    volumePercent = 0
    clamped = true
    notes.push(`glycol percentage ${stated} is not valid; treated as 0 %`)
  } else if (stated > MAX_GLYCOL_VOLUME_PERCENT) {
    volumePercent = MAX_GLYCOL_VOLUME_PERCENT
    clamped = true
    notes.push(`glycol ${stated} % by volume is outside the 0–${MAX_GLYCOL_VOLUME_PERCENT} % the tables cover; figures are for ${MAX_GLYCOL_VOLUME_PERCENT} %`)
  }
  return { fluid: mix.fluid, volumePercent, massPercent: volumeToMassPercent(mix.fluid, volumePercent), clamped, notes }
}
