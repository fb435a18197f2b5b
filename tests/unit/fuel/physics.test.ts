// The fuel figures of the physics layer against exact unit definitions and the trade's worked examples.
// Sources beside each check; /work/shared/reference/check-values.md §5–§7 hold the vetted values.
import { describe, expect, it } from 'vitest'
import {
  FUEL_PROPERTIES, G_PER_KWH_PER_LB_PER_HP_H, bsfcToGPerKwh, bsfcToLbPerHpH, ccPerMinToLbPerHour, hpToKw,
  injectorFlowAt, injectorFlowNeeded, kwToHp, lbPerHourToCcPerMin, litresPerHourToUsGallonsPerHour, PETROL_DENSITY_KG_L,
} from '#shared/physics/fuel'
import { inchMm } from '#shared/circuit'
import { FUEL_SPIGOT_LARGE_MM, FUEL_SPIGOT_MM } from '#shared/circuit/fuelPartDefaults'

describe('injector sizing: flow per injector = power × BSFC / (injectors × duty)', () => {
  it('400 hp × 0.50 lb/(hp·h) / (8 × 0.80) = 31.25 lb/h (worked example, common practice)', () => {
    // 400 × 0.50 = 200 lb/h for the engine; 8 × 0.80 = 6.4; 200 / 6.4 = 31.25 lb/h per injector
    expect(injectorFlowNeeded(400, 0.5, 8, 0.8)).toBeCloseTo(31.25, 10)
  })

  it('31.25 lb/h is about 328 cc/min at 0.72 kg/L, about 319 cc/min at 0.74 kg/L', () => {
    // 1 lb = 453.59237 g exactly (international yard and pound, 1959). At a density ρ g/cc:
    // 31.25 × 453.59237 / 60 / ρ. ρ = 0.72 (the SG behind the trade's ×10.5 factor, check-values §6):
    // 14 174.76 / 60 / 0.72 = 328.12 cc/min. ρ = 0.74 kg/L, the app's petrol (middle of EN 228's
    // 0.720–0.775; from memory): 319.25 cc/min.
    expect(lbPerHourToCcPerMin(31.25, 0.72)).toBeCloseTo(328.12, 2)
    expect(lbPerHourToCcPerMin(31.25, PETROL_DENSITY_KG_L)).toBeCloseTo(319.25, 2)
    expect(PETROL_DENSITY_KG_L).toBeGreaterThanOrEqual(0.72)
    expect(PETROL_DENSITY_KG_L).toBeLessThanOrEqual(0.775)
    // the trade's rule of thumb: 1 lb/h ≈ 10.5 cc/min at SG 0.72 (common practice)
    expect(lbPerHourToCcPerMin(1, 0.72)).toBeCloseTo(10.5, 1)
    // and back again
    expect(ccPerMinToLbPerHour(lbPerHourToCcPerMin(31.25, 0.745), 0.745)).toBeCloseTo(31.25, 10)
  })

  it('refuses a sizing with no injectors or no duty instead of answering Infinity', () => {
    expect(() => injectorFlowNeeded(400, 0.5, 0, 0.8)).toThrow(/above 0/)
    expect(() => injectorFlowNeeded(400, 0.5, 8, 0)).toThrow(/above 0/)
  })
})

describe('injector flow goes with the square root of the pressure across it (common practice)', () => {
  it('3 → 4 bar raises the flow by √(4/3) = 1.1547', () => {
    expect(injectorFlowAt(1, 300, 400)).toBeCloseTo(1.1547, 4)
    expect(injectorFlowAt(550, 300, 400)).toBeCloseTo(635.09, 2)
  })
  it('43.5 → 58 psi is the same ratio in the other unit (check-values §7)', () => {
    expect(injectorFlowAt(1, 43.5, 58)).toBeCloseTo(1.1547, 4)
  })
  it('at the rated pressure the flow is the rating; with no pressure across it, nothing flows', () => {
    expect(injectorFlowAt(440, 300, 300)).toBe(440)
    expect(injectorFlowAt(440, 300, 0)).toBe(0)
    expect(injectorFlowAt(440, 300, -50)).toBe(0)
    expect(() => injectorFlowAt(440, 0, 300)).toThrow(/rated pressure/)
  })
})

describe('power and fuel consumption units', () => {
  it('1 hp = 550 ft·lbf/s = 745.699872 W (exact foot and pound-force)', () => {
    expect(kwToHp(0.745699872)).toBeCloseTo(1, 8)
    expect(hpToKw(400)).toBeCloseTo(298.28, 2)
  })
  it('1 lb/(hp·h) = 453.59237 g / 0.745699872 kWh = 608.277 g/kWh', () => {
    expect(G_PER_KWH_PER_LB_PER_HP_H).toBeCloseTo(608.277, 3)
    expect(bsfcToGPerKwh(0.5)).toBeCloseTo(304.14, 2)
    expect(bsfcToLbPerHpH(304)).toBeCloseTo(0.4998, 4)
  })
  it('1 US gallon = 3.785411784 L exactly (NIST Handbook 44 App. C)', () => {
    expect(litresPerHourToUsGallonsPerHour(3.785411784)).toBeCloseTo(1, 12)
    expect(litresPerHourToUsGallonsPerHour(255)).toBeCloseTo(67.36, 2)
  })
})

describe('fuel densities', () => {
  it('petrol 0.740 kg/L, ethanol 0.789; E10 by volume mixing 0.745, E85 0.782 (ideal mixing; from memory)', () => {
    expect(FUEL_PROPERTIES.petrol.densityKgL).toBe(0.74)
    expect(FUEL_PROPERTIES.e10.densityKgL).toBeCloseTo(0.9 * 0.74 + 0.1 * 0.789, 3)
    expect(FUEL_PROPERTIES.e85.densityKgL).toBeCloseTo(0.15 * 0.74 + 0.85 * 0.789, 3)
    expect(FUEL_PROPERTIES.e85.ethanolPercent).toBe(85)
  })
})

describe('fuel line sizes in both unit systems (25.4 mm per inch exactly; check-values §5)', () => {
  it('1/4, 5/16 and 3/8 in are 6.35, 7.94 and 9.53 mm to the drawing’s 0.01 mm', () => {
    expect(inchMm(1 / 4)).toBe(6.35)
    expect(inchMm(5 / 16)).toBe(7.94)
    expect(inchMm(3 / 8)).toBe(9.53)
    expect(FUEL_SPIGOT_MM).toBe(7.94)
    expect(FUEL_SPIGOT_LARGE_MM).toBe(9.53)
  })
  it('6, 8 and 10 mm sit 0.35, 0.06 and 0.47 mm from their inch neighbours', () => {
    expect(Math.abs(inchMm(1 / 4) - 6)).toBeCloseTo(0.35, 2)
    expect(Math.abs(inchMm(5 / 16) - 8)).toBeCloseTo(0.06, 2)
    expect(Math.abs(inchMm(3 / 8) - 10)).toBeCloseTo(0.47, 2)
  })
})
