import { beforeAll, describe, expect, it } from 'vitest'
import {
  colebrookFrictionFactor, darcyFrictionFactor, darcyPressureDropPerMetre, frictionFactorWithSlope, fullyRoughFrictionFactor,
  laminarFrictionFactor, reynoldsNumber, velocityFromFlow,
} from '#shared/physics'
import { relativeDifference, runReference } from './reference-libraries'

describe('laminar friction factor', () => {
  it('is exactly 64/Re below Re = 2300 (Hagen–Poiseuille; fluids.friction_laminar(128) = 0.5)', () => {
    expect(laminarFrictionFactor(128)).toBe(0.5)
    for (const re of [1, 10, 128, 500, 2000, 2299.9]) expect(darcyFrictionFactor(re, 1e-3)).toBe(64 / re)
    expect(darcyFrictionFactor(2000, 0)).toBe(0.032) // check-values §4 worked values, Re = 2000
  })
})

describe('Colebrook–White (documented library examples, fluids docstrings, check-values §4)', () => {
  it('Colebrook(1e5, 1e-4) = 0.018513866077471 and Clamond(1e5, 1e-4) = 0.01851386607747165', () => {
    expect(relativeDifference(colebrookFrictionFactor(1e5, 1e-4), 0.018513866077471)).toBeLessThan(1e-13)
    expect(relativeDifference(colebrookFrictionFactor(1e5, 1e-4), 0.01851386607747165)).toBeLessThan(1e-14)
  })

  it.each([
    [4000, 0, 0.039907], [1e4, 0, 0.030883], [1e5, 0, 0.01799], [1e6, 0, 0.011645], [5e4, 1e-3, 0.024021],
    [1e6, 1e-3, 0.019943], [1e5, 1e-2, 0.038504], [7e5, 1e-2, 0.037991], [1e7, 1e-5, 0.008996], [1e8, 5e-2, 0.071551],
  ])('Re = %d, ε/D = %f → f = %f (check-values §4 worked values, printed to 6 decimals)', (re, ed, f) => {
    expect(Math.abs(darcyFrictionFactor(re, ed) - f)).toBeLessThanOrEqual(5e-7 + 1e-12)
  })

  it('fully rough limit: ε/D = 1e-2 → 0.037904, 1e-3 → 0.019635 (von Kármán, check-values §4)', () => {
    expect(Math.abs(fullyRoughFrictionFactor(1e-2) - 0.037904)).toBeLessThanOrEqual(5e-7)
    expect(Math.abs(fullyRoughFrictionFactor(1e-3) - 0.019635)).toBeLessThanOrEqual(5e-7)
  })

  it('Moody chart readings (±5 % smooth, ±10 % rough, Moody 1944): (1e5, smooth) ≈ 0.018, (1e6, 1e-3) ≈ 0.020', () => {
    expect(relativeDifference(darcyFrictionFactor(1e5, 0), 0.018)).toBeLessThan(0.05)
    expect(relativeDifference(darcyFrictionFactor(1e6, 1e-3), 0.02)).toBeLessThan(0.1)
  })
})

describe('transitional blend 2300–4000', () => {
  it('meets the laminar law at 2300 and Colebrook at 4000 with matching value', () => {
    expect(darcyFrictionFactor(2300, 1e-4)).toBeCloseTo(64 / 2300, 12)
    expect(darcyFrictionFactor(4000, 1e-4)).toBeCloseTo(colebrookFrictionFactor(4000, 1e-4), 12)
  })

  it('is continuous and its slope agrees with a finite difference everywhere', () => {
    for (const ed of [0, 1e-4, 1e-2]) {
      for (let re = 500; re < 2e6; re *= 1.37) {
        const h = re * 1e-6
        const numeric = (darcyFrictionFactor(re + h, ed) - darcyFrictionFactor(re - h, ed)) / (2 * h)
        const analytic = frictionFactorWithSlope(re, ed).dfdRe
        expect(Math.abs(numeric - analytic)).toBeLessThan(1e-6 * Math.abs(analytic) + 1e-14)
      }
      for (const edge of [2300, 4000]) {
        expect(Math.abs(darcyFrictionFactor(edge * (1 + 1e-9), ed) - darcyFrictionFactor(edge * (1 - 1e-9), ed))).toBeLessThan(1e-9)
      }
    }
  })

  it('keeps the head loss rising with flow (f·Re² increasing), as the network solver needs', () => {
    let previous = 0
    for (let re = 100; re < 1e6; re *= 1.05) {
      const fr2 = darcyFrictionFactor(re, 1e-3) * re * re
      expect(fr2).toBeGreaterThan(previous)
      previous = fr2
    }
  })
})

describe('Darcy–Weisbach worked example (check-values §4)', () => {
  // 80 °C water at 2 bar: ρ = 971.83 kg/m³, μ = 0.35408 mPa·s; D = 38.1 mm; Q = 100 L/min
  const water80 = { densityKgM3: 971.83, viscosityPaS: 0.35408e-3 }
  it('v = 1.4619 m/s, Re = 152 872, smooth f = 0.016493, Δp = 449.5 Pa/m, ρv²/2 = 1038.4 Pa', () => {
    const r = darcyPressureDropPerMetre(100, 0.0381, 0, water80)
    expect(r.velocityMS).toBeCloseTo(1.4619, 4)
    // μ is given to 5 digits (±1.4e-5 relative), so Re can only be matched to that
    expect(relativeDifference(r.reynolds, 152872)).toBeLessThan(2e-5)
    expect(r.frictionFactor!).toBeCloseTo(0.016493, 6)
    expect(r.pressureDropPaPerM).toBeCloseTo(449.5, 1)
    expect(r.velocityPressurePa).toBeCloseTo(1038.4, 1)
  })

  it('ε = 1.5 µm: f = 0.016763, Δp = 456.9 Pa/m', () => {
    const r = darcyPressureDropPerMetre(100, 0.0381, 1.5e-6, water80)
    expect(r.frictionFactor!).toBeCloseTo(0.016763, 6)
    expect(r.pressureDropPaPerM).toBeCloseTo(456.9, 1)
  })

  it('50 % EG at 90 °C (ρ = 1019.0, μ = 0.8195 mPa·s): Re = 69 258, f = 0.01945, Δp = 555.8 Pa/m', () => {
    const r = darcyPressureDropPerMetre(100, 0.0381, 0, { densityKgM3: 1019, viscosityPaS: 0.8195e-3 })
    // μ = 0.8195 has 4 digits (±6e-5 relative)
    expect(relativeDifference(r.reynolds, 69258)).toBeLessThan(7e-5)
    expect(r.frictionFactor!).toBeCloseTo(0.01945, 5)
    expect(r.pressureDropPaPerM).toBeCloseTo(555.8, 1)
  })

  it('helpers are consistent and zero flow gives zero drop', () => {
    const v = velocityFromFlow(100, 0.0381)
    expect(reynoldsNumber(-v, 0.0381, 971.83, 0.35408e-3)).toBeCloseTo(reynoldsNumber(v, 0.0381, 971.83, 0.35408e-3), 9)
    const zero = darcyPressureDropPerMetre(0, 0.0381, 0, water80)
    expect(zero.pressureDropPaPerM).toBe(0)
    expect(zero.frictionFactor).toBeNull()
    expect(darcyPressureDropPerMetre(-100, 0.0381, 0, water80).pressureDropPaPerM).toBeCloseTo(-449.5, 1)
  })
})

describe('friction factor against python3-fluids (live)', () => {
  const reynolds = [4000, 6000, 1e4, 3e4, 1e5, 3e5, 1e6, 1e7, 1e8]
  const roughness = [0, 1e-6, 1e-5, 1e-4, 1e-3, 1e-2, 5e-2]
  const grid = reynolds.flatMap(re => roughness.map(ed => [re, ed] as const))
  let clamond: number[]
  let colebrook: number[]
  let laminar: number[]
  let version: string
  beforeAll(() => {
    const out = runReference<number>('fluids_reference.py', grid.map(([re, ed]) => ({ fn: 'friction_factor', args: [re], kwargs: { eD: ed } })))
    clamond = out.results
    version = out.version
    colebrook = runReference<number>('fluids_reference.py', grid.map(([re, ed]) => ({ fn: 'Colebrook', args: [re, ed] }))).results
    laminar = runReference<number>('fluids_reference.py', [64, 300, 1000, 2200].map(re => ({ fn: 'friction_laminar', args: [re] }))).results
  })

  it('compares with fluids 1.0.x', () => {
    expect(version).toMatch(/^1\.0\./)
  })

  it('equals fluids.friction_factor (Clamond) to 1e-13 over Re 4e3…1e8 × ε/D 0…0.05', () => {
    grid.forEach(([re, ed], i) => expect(relativeDifference(darcyFrictionFactor(re, ed), clamond[i]!)).toBeLessThan(1e-13))
  })

  it('equals fluids.Colebrook (exact Lambert-W solution) to 1e-12', () => {
    grid.forEach(([re, ed], i) => expect(relativeDifference(darcyFrictionFactor(re, ed), colebrook[i]!)).toBeLessThan(1e-12))
  })

  it('laminar values equal fluids.friction_laminar exactly', () => {
    ;[64, 300, 1000, 2200].forEach((re, i) => expect(darcyFrictionFactor(re, 0)).toBe(laminar[i]))
  })
})
