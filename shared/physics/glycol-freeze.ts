// Freezing point of glycol–water coolant from published tables on a VOLUME basis, linearly
// interpolated between rows.
//
// Ethylene glycol: Engineering ToolBox, "Ethylene Glycol Heat-Transfer Fluid", freezing point by
//   volume % (0–60 %). This table belongs to the ASHRAE family of EG data (50 vol % → −37 °C).
// Propylene glycol: Lange's Handbook of Chemistry, 15th ed., Table 5.13 "Compositions of Aqueous
//   Antifreeze Solutions" (5–50 vol %). Between 50 and 60 vol % the table has no rows; there we use
//   Melinder's (2010) propylene glycol fit on the mass basis, which meets the table's 50 % row
//   within 0.3 K.
// 0 % is pure water at 1 atm: 0 °C.

import { MELINDER_MAX_MASS_PERCENT, melinderFreezePointC } from './glycol-melinder'
import { normaliseMix, volumeToMassPercent, type Glycol } from './glycol-mix'
import type { CoolantMix } from './types'

type Table = ReadonlyArray<readonly [volumePercent: number, freezeC: number]>

export const ETHYLENE_GLYCOL_FREEZE_TABLE: Table = [
  [0, 0], [10, -3], [20, -8], [30, -16], [40, -25], [50, -37], [60, -55],
]
export const ETHYLENE_GLYCOL_FREEZE_SOURCE = 'Engineering ToolBox ethylene glycol freezing points by volume %, linear interpolation'

export const PROPYLENE_GLYCOL_FREEZE_TABLE: Table = [
  [0, 0], [5, -1.1], [10, -2.2], [15, -3.9], [20, -6.7], [25, -8.9], [30, -12.8], [35, -16.1],
  [40, -20.6], [45, -26.7], [50, -33.3],
]
export const PROPYLENE_GLYCOL_FREEZE_SOURCE = "Lange's Handbook of Chemistry 15th ed. Table 5.13 (propylene glycol by volume %), linear interpolation"

export interface FreezePoint {
  tempC: number
  source: string
  /** the stated percentage was outside the supported range and was clamped */
  clamped: boolean
  notes: string[]
}

function interpolate(table: Table, x: number): number {
  const first = table[0]!
  if (x <= first[0]) return first[1]
  for (let k = 1; k < table.length; k++) {
    const [x1, y1] = table[k]!
    if (x <= x1) {
      const [x0, y0] = table[k - 1]!
      return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0)
    }
  }
  return table[table.length - 1]![1]
}

function glycolFreeze(glycol: Glycol, volumePercent: number): { tempC: number; source: string; notes: string[] } {
  if (glycol === 'ethylene-glycol') {
    const notes = volumePercent > 50
      ? ['above 50 % the ethylene glycol tables disagree by up to 3 K (ASHRAE fit: −52 °C at 60 %, this table −55 °C)']
      : []
    return { tempC: interpolate(ETHYLENE_GLYCOL_FREEZE_TABLE, volumePercent), source: ETHYLENE_GLYCOL_FREEZE_SOURCE, notes }
  }
  const lastRow = PROPYLENE_GLYCOL_FREEZE_TABLE[PROPYLENE_GLYCOL_FREEZE_TABLE.length - 1]!
  if (volumePercent <= lastRow[0]) {
    return { tempC: interpolate(PROPYLENE_GLYCOL_FREEZE_TABLE, volumePercent), source: PROPYLENE_GLYCOL_FREEZE_SOURCE, notes: [] }
  }
  const massPercent = volumeToMassPercent('propylene-glycol', volumePercent)
  return {
    tempC: melinderFreezePointC('propylene-glycol', massPercent),
    source: 'Melinder (2010) propylene glycol freezing-point fit, mass basis (beyond the last row of Lange Table 5.13)',
    notes: massPercent > MELINDER_MAX_MASS_PERCENT
      ? [`${massPercent.toFixed(1)} mass % is beyond the fit's ${MELINDER_MAX_MASS_PERCENT} %: extrapolated`]
      : [],
  }
}

/** Freezing point (first ice crystals) of a coolant mix, with the table used and any clamping. */
export function freezePoint(mix: CoolantMix): FreezePoint {
  const m = normaliseMix(mix)
  if (m.fluid === 'water') return { tempC: 0, source: 'pure water at 1 atm', clamped: false, notes: [] }
  const r = glycolFreeze(m.fluid, m.volumePercent)
  return { tempC: r.tempC, source: r.source, clamped: m.clamped, notes: [...m.notes, ...r.notes] }
}

/** Freezing point of a coolant mix, °C. */
export function freezePointC(mix: CoolantMix): number {
  return freezePoint(mix).tempC
}
