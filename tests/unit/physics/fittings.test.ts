import { beforeAll, describe, expect, it } from 'vitest'
import {
  bendK, craneBendLOverD, craneFullyTurbulentFrictionFactor, EXIT_K, fittingK, fullyRoughFrictionFactor, ROUGHNESS_M,
  SHARP_ENTRANCE_K, suddenContractionK, suddenExpansionK, totalMinorK, CRANE_BEND_L_OVER_D,
} from '#shared/physics'
import { relativeDifference, runReference } from './reference-libraries'

const SIZES_M = [0.0127, 0.01905, 0.0254, 0.0381, 0.0508]

describe('Crane f_T and K = (L/D)·f_T', () => {
  it('f_T at 1/2…2 in matches the fluids.ft_Crane figures of check-values §4 (0.0271, 0.0243, 0.0225, 0.0204, 0.0190)', () => {
    const expected = [0.0271, 0.0243, 0.0225, 0.0204, 0.019]
    SIZES_M.forEach((d, i) => expect(Math.abs(craneFullyTurbulentFrictionFactor(d) - expected[i]!)).toBeLessThanOrEqual(5e-5))
  })

  it('and Crane A-26 rounded f_T (0.027, 0.025, 0.023, 0.021, 0.019 — from memory) within 0.001', () => {
    const crane = [0.027, 0.025, 0.023, 0.021, 0.019]
    SIZES_M.forEach((d, i) => expect(Math.abs(craneFullyTurbulentFrictionFactor(d) - crane[i]!)).toBeLessThan(0.001))
  })

  it('tee run 20·f_T, tee branch 60·f_T, 45° elbow 16·f_T (Crane TP-410, Eng-Tips quotes), 90° elbow 30·f_T (from memory)', () => {
    const d = 0.0254
    const ft = craneFullyTurbulentFrictionFactor(d)
    expect(fittingK({ kind: 'tee-run' }, d)).toBeCloseTo(20 * ft, 14)
    expect(fittingK({ kind: 'tee-branch' }, d)).toBeCloseTo(60 * ft, 14)
    expect(fittingK({ kind: 'elbow', angleDeg: 45 }, d)).toBeCloseTo(16 * ft, 14)
    expect(fittingK({ kind: 'elbow', angleDeg: 90 }, d)).toBeCloseTo(30 * ft, 14)
  })

  it('90° bends use the Crane A-29 L/D table (r/d 1.5 → 14 confirmed; the other rows from memory), linear between rows', () => {
    expect(craneBendLOverD(1.5)).toBe(14)
    expect(craneBendLOverD(1)).toBe(20)
    expect(craneBendLOverD(2.5)).toBe(12)
    expect(craneBendLOverD(5)).toBeCloseTo(15.5, 12)
    expect(craneBendLOverD(0.5)).toBe(20) // clamped
    const d = 0.0381
    expect(bendK(d, 90, 1.5)).toBeCloseTo(14 * craneFullyTurbulentFrictionFactor(d), 14)
  })

  it('switches f_T to the fully rough limit of the wall when asked', () => {
    const d = 0.02
    expect(fittingK({ kind: 'tee-run' }, d, { fullyTurbulentBasis: { roughnessM: 1e-4 } })).toBeCloseTo(20 * fullyRoughFrictionFactor(1e-4 / d), 14)
  })
})

describe('entrance, exit, expansion, contraction', () => {
  it('sharp entrance 0.5 (Crane, Idelchik, Blevins), exit 1.0 (fluids docstrings; HVAC Pump Handbook Table 3.7)', () => {
    expect(SHARP_ENTRANCE_K).toBe(0.5)
    expect(EXIT_K).toBe(1)
    expect(fittingK({ kind: 'entrance-sharp' }, 0.02)).toBe(0.5)
    expect(fittingK({ kind: 'exit' }, 0.02)).toBe(1)
  })

  it('Borda–Carnot: d 0.5 → 1 gives 0.5625 on the small-bore velocity (fluids diffuser_sharp docstring)', () => {
    expect(suddenExpansionK(0.5, 1)).toBe(0.5625)
    expect(fittingK({ kind: 'expansion', largeDiameterM: 1 }, 0.5)).toBe(0.5625)
    expect(fittingK({ kind: 'expansion', largeDiameterM: 0.4 }, 0.5)).toBe(0)
  })

  it('Rennels contraction 1 → 0.4 gives 0.5301269161 (fluids contraction_sharp docstring); Crane 0.5(1 − β²) = 0.42', () => {
    // the docstring prints 10 decimals, truncated
    expect(Math.abs(suddenContractionK(1, 0.4, 'rennels') - 0.5301269161)).toBeLessThan(1e-10)
    expect(suddenContractionK(1, 0.4, 'crane')).toBeCloseTo(0.42, 14)
  })

  it('sums a list of fittings', () => {
    const d = 0.019
    const k = totalMinorK([{ kind: 'entrance-sharp' }, { kind: 'bend', angleDeg: 90, radiusOverDiameter: 3 }, { kind: 'exit' }, { kind: 'fixed', k: 2 }], d)
    expect(k).toBeCloseTo(0.5 + 12 * craneFullyTurbulentFrictionFactor(d) + 1 + 2, 14)
  })

  it('roughness defaults are small against hose bores (ε/D < 1e-3 for a 10 mm hose), as common practice expects', () => {
    for (const r of Object.values(ROUGHNESS_M)) expect(r / 0.01).toBeLessThan(1e-2)
    expect(ROUGHNESS_M.hardLine).toBeLessThan(ROUGHNESS_M.rubberHose)
  })
})

describe('fittings against python3-fluids (live)', () => {
  const ratios = CRANE_BEND_L_OVER_D.map(([r]) => r)
  let ft: number[]
  let ftExact: number[]
  let bends90: number[]
  let bendsAngled: number[]
  let bendsBetween: number[]
  let viaBendRounded: number[]
  let singles: number[]
  const angled = [[0.0254, 45, 1.5], [0.0381, 30, 3], [0.019, 180, 2], [0.05, 60, 6]] as const
  const between = [1.25, 2.5, 3.5, 5, 7, 9, 11, 15, 18] as const
  beforeAll(() => {
    ft = runReference<number>('fluids_reference.py', SIZES_M.map(d => ({ fn: 'ft_Crane', args: [d] }))).results
    ftExact = runReference<number>('fluids_reference.py', SIZES_M.map(d => ({ fn: 'Colebrook', args: [7.5e6 * d, 3.4126825352925e-5 * d ** -1.0112] }))).results
    bends90 = runReference<number>('fluids_reference.py', ratios.map(r => ({ fn: 'bend_rounded_Crane', args: [0.0254, 90], kwargs: { bend_diameters: r } }))).results
    bendsAngled = runReference<number>('fluids_reference.py', angled.map(([d, a, r]) => ({ fn: 'bend_rounded_Crane', args: [d, a], kwargs: { bend_diameters: r } }))).results
    bendsBetween = runReference<number>('fluids_reference.py', between.map(r => ({ fn: 'bend_rounded_Crane', args: [0.0254, 90], kwargs: { bend_diameters: r } }))).results
    viaBendRounded = runReference<number>('fluids_reference.py', [{ fn: 'bend_rounded', args: [0.0254, 90], kwargs: { bend_diameters: 1.5, method: 'Crane' } }]).results
    singles = runReference<number>('fluids_reference.py', [
      { fn: 'entrance_sharp', kwargs: { method: 'Crane' } },
      { fn: 'exit_normal' },
      { fn: 'diffuser_sharp', args: [0.5, 1] },
      { fn: 'diffuser_sharp', args: [0.019, 0.032] },
      { fn: 'contraction_sharp', args: [1, 0.4] },
      { fn: 'contraction_sharp', args: [0.032, 0.019] },
      { fn: 'contraction_sharp', args: [0.032, 0.019], kwargs: { method: 'Crane' } },
    ]).results
  })

  // fluids.ft_Crane takes a single Clamond step for D ≥ 10 mm ("accurate to 5-8 decimals" per its
  // docstring); we take both steps, i.e. the exact Colebrook root of the same definition.
  it('f_T equals fluids.ft_Crane to 1e-5 and fluids.Colebrook at the same Re and ε/D to 1e-12', () => {
    SIZES_M.forEach((d, i) => expect(relativeDifference(craneFullyTurbulentFrictionFactor(d), ft[i]!)).toBeLessThan(1e-5))
    SIZES_M.forEach((d, i) => expect(relativeDifference(craneFullyTurbulentFrictionFactor(d), ftExact[i]!)).toBeLessThan(1e-12))
  })

  // fluids passes a Chebyshev fit through the same A-29 rows; measured, the fit misses the rounded rows
  // by up to 1.0 % (r/d 2: 11.885 for 12; r/d 3: 12.121 for 12), while we return the rows themselves.
  it('90° bend K at the A-29 rows is within 1.1 % of fluids.bend_rounded_Crane (its fit through the same table)', () => {
    ratios.forEach((r, i) => expect(relativeDifference(bendK(0.0254, 90, r), bends90[i]!)).toBeLessThan(0.011))
    expect(relativeDifference(bendK(0.0254, 90, 1.5), viaBendRounded[0]!)).toBeLessThan(0.011)
    expect(relativeDifference(bendK(0.0254, 90, 1), bends90[0]!)).toBeLessThan(1e-5) // r/d 1: both exactly 20·f_T
  })

  it('between rows our linear interpolation stays within 8 % of fluids\u2019 smooth fit', () => {
    between.forEach((r, i) => expect(relativeDifference(bendK(0.0254, 90, r), bendsBetween[i]!)).toBeLessThan(0.08))
  })

  // the rule subtracts a fixed 0.25·π·f_T·r/d term, so the fit's 1 % K90 gap grows to 1.3 % at 30°
  it('other angles follow the same Crane n-bend rule as fluids (within 1.5 %)', () => {
    angled.forEach(([d, a, r], i) => expect(relativeDifference(bendK(d, a, r), bendsAngled[i]!)).toBeLessThan(0.015))
  })

  it('entrance_sharp(Crane), exit_normal, diffuser_sharp, contraction_sharp (Rennels and Crane) agree exactly', () => {
    expect(SHARP_ENTRANCE_K).toBe(singles[0])
    expect(EXIT_K).toBe(singles[1])
    expect(suddenExpansionK(0.5, 1)).toBeCloseTo(singles[2]!, 14)
    expect(suddenExpansionK(0.019, 0.032)).toBeCloseTo(singles[3]!, 14)
    expect(suddenContractionK(1, 0.4, 'rennels')).toBeCloseTo(singles[4]!, 14)
    expect(suddenContractionK(0.032, 0.019, 'rennels')).toBeCloseTo(singles[5]!, 14)
    expect(suddenContractionK(0.032, 0.019, 'crane')).toBeCloseTo(singles[6]!, 14)
  })
})
