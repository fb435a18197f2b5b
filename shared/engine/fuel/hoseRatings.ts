// What each hose material may carry in a fuel circuit. From memory, after the SAE J30 classes as the
// trade uses them (check-values §5): R6 and R7 are low-pressure carburettor and return hose, not for
// the pressure side of an injection system; R9 is injection hose for the pressure side; R10 is the
// submersible in-tank class; R14 is low-permeation hose for low pressure only (about 50 psi). The
// ethanol shares are the usual marking of each class; a hose marked by its maker for more is fine.
import type { HoseMaterial } from '../../circuit'

export interface FuelHoseRating {
  /** made for petrol at all (coolant hose is not: petrol swells and softens it) */
  fuel: boolean
  /** may sit on the pressure side between the pump and the regulator */
  pressureSide: boolean
  /** working pressure, kPa gauge; null where the tube, not the pressure, decides */
  workingKpa: number | null
  /** highest ethanol share by volume it is rated for, % */
  maxEthanolPercent: number
  words: string
}

export const FUEL_HOSE_RATINGS: Record<HoseMaterial, FuelHoseRating> = {
  'j20-r3-heater': { fuel: false, pressureSide: false, workingKpa: null, maxEthanolPercent: 0, words: 'heater hose (SAE J20 R3), a coolant class' },
  'j20-r4-radiator': { fuel: false, pressureSide: false, workingKpa: null, maxEthanolPercent: 0, words: 'radiator hose (SAE J20 R4), a coolant class' },
  silicone: { fuel: false, pressureSide: false, workingKpa: null, maxEthanolPercent: 0, words: 'silicone coolant hose' },
  'j30-r6': { fuel: true, pressureSide: false, workingKpa: 345, maxEthanolPercent: 10, words: 'low-pressure carburettor hose (SAE J30 R6)' },
  'j30-r7': { fuel: true, pressureSide: false, workingKpa: 345, maxEthanolPercent: 10, words: 'low-pressure fuel hose (SAE J30 R7)' },
  'j30-r9': { fuel: true, pressureSide: true, workingKpa: 690, maxEthanolPercent: 10, words: 'fuel-injection hose (SAE J30 R9)' },
  'j30-r10': { fuel: true, pressureSide: true, workingKpa: 690, maxEthanolPercent: 10, words: 'in-tank fuel hose (SAE J30 R10)' },
  'j30-r14': { fuel: true, pressureSide: false, workingKpa: 345, maxEthanolPercent: 85, words: 'low-permeation fuel hose (SAE J30 R14)' },
  'ptfe-lined': { fuel: true, pressureSide: true, workingKpa: 6900, maxEthanolPercent: 100, words: 'PTFE-lined braided hose' },
  'hard-line': { fuel: true, pressureSide: true, workingKpa: null, maxEthanolPercent: 100, words: 'hard line' },
}

/** The hose to use instead: injection hose on the pressure side, low-pressure hose elsewhere, ethanol-proof when needed. */
export function suitableFuelHose(pressureSide: boolean, ethanolPercent: number, railKpa: number): HoseMaterial {
  const fits = (m: HoseMaterial) => {
    const r = FUEL_HOSE_RATINGS[m]
    return r.fuel && r.maxEthanolPercent >= ethanolPercent && (!pressureSide || (r.pressureSide && (r.workingKpa === null || r.workingKpa >= railKpa)))
  }
  const order: HoseMaterial[] = pressureSide ? ['j30-r9', 'ptfe-lined'] : ['j30-r7', 'j30-r9', 'j30-r14', 'ptfe-lined']
  return order.find(fits) ?? 'ptfe-lined'
}
