import { beforeAll, describe, expect, it } from 'vitest'
import {
  coolantProperties, if97Region1, saturationPressureKpa, waterDensity, waterDensityKell, waterViscosity, waterViscosityIapws2008,
} from '#shared/physics'
import { relativeDifference, runReference } from './reference-libraries'

describe('IF97 region 1 verification values', () => {
  it('3 MPa, 300 K: v = 0.100215168e-2 m³/kg, h = 115.331273 kJ/kg (IAPWS R7-97 Table 5)', () => {
    const s = if97Region1(300, 3)
    expect(relativeDifference(s.specificVolume, 0.100215168e-2)).toBeLessThan(1e-8)
    expect(relativeDifference(s.enthalpy, 115.331273)).toBeLessThan(1e-8)
  })

  it('80 MPa, 300 K: v = 0.971180894e-3; 3 MPa, 500 K: v = 0.120241800e-2 (IAPWS R7-97 Table 5; check-values §2)', () => {
    expect(relativeDifference(if97Region1(300, 80).specificVolume, 0.971180894e-3)).toBeLessThan(1e-8)
    expect(relativeDifference(if97Region1(500, 3).specificVolume, 0.1202418e-2)).toBeLessThan(1e-8)
  })

  it('80 MPa, 300 K: cp = 4.01008987 kJ/(kg·K) (IAPWS R7-97 Table 5)', () => {
    expect(relativeDifference(if97Region1(300, 80).isobaricHeatCapacity, 4.01008987)).toBeLessThan(1e-8)
  })
})

describe('IAPWS 2008 viscosity verification values (IAPWS R12-08 Table 4, μ2 = 1)', () => {
  // Table 4 lists these points without the critical enhancement; 8 digits given.
  it.each([
    [298.15, 998, 889.7351],
    [298.15, 1200, 1437.649467],
    [373.15, 1000, 307.883622],
    [433.15, 1000, 217.685358],
    [433.15, 1, 14.538324],
  ])('T = %f K, ρ = %f kg/m³ → %f µPa·s', (t, rho, micro) => {
    expect(relativeDifference(waterViscosityIapws2008(t, rho) * 1e6, micro)).toBeLessThan(1e-7)
  })
})

describe('water at about 1 atm against published tables (check-values §2)', () => {
  // ρ: IAPWS-95 values (CoolProp HEOS); tolerance 0.05 kg/m³ as suggested there. The 100 °C row is
  // saturated liquid, which is what waterDensity gives above the normal boiling point.
  it.each([
    [20, 998.207], [40, 992.216], [60, 983.196], [80, 971.79], [90, 965.31], [100, 958.349],
  ])('ρ(%d °C) = %f kg/m³ (IAPWS-95)', (t, rho) => {
    expect(Math.abs(waterDensity(t) - rho)).toBeLessThan(0.05)
  })

  it.each([
    [20, 998.2], [40, 992.2], [60, 983.2], [80, 971.8], [90, 965.4], [100, 958.4],
  ])('ρ(%d °C) ≈ %f kg/m³ (LSBU water data table, rounded to 0.1)', (t, rho) => {
    expect(Math.abs(waterDensity(t) - rho)).toBeLessThan(0.1)
  })

  it('ρ(25 °C) = 997.0479 kg/m³ (published density table)', () => {
    expect(Math.abs(waterDensity(25) - 997.0479)).toBeLessThan(0.05)
  })

  // μ: IAPWS 2008 figures to 0.3 %, EngineersEdge 4-figure table to 1 %
  it.each([
    [20, 1.0016, 1.002], [40, 0.6527, 0.6531], [60, 0.466, 0.4658], [80, 0.3541, 0.355], [90, 0.3142, 0.315], [100, 0.2816, 0.2822],
  ])('μ(%d °C) = %f mPa·s (IAPWS 2008), %f (EngineersEdge)', (t, iapws, table) => {
    const mu = waterViscosity(t) * 1000
    expect(relativeDifference(mu, iapws)).toBeLessThan(0.003)
    expect(relativeDifference(mu, table)).toBeLessThan(0.01)
  })

  it('Kell ITS-90 recast reproduces its derived values (check-values §2) and stays within 0.02 kg/m³ of IF97', () => {
    const derived: Array<[number, number]> = [[20, 998.204], [40, 992.216], [60, 983.199], [80, 971.798], [90, 965.32], [100, 958.364]]
    for (const [t, rho] of derived) {
      expect(Math.abs(waterDensityKell(t) - rho)).toBeLessThan(0.0015)
      expect(Math.abs(waterDensityKell(t) - waterDensity(t))).toBeLessThan(0.02)
    }
  })

  it('coolantProperties for water names its formulations and never returns NaN across 0–150 °C', () => {
    for (let t = 0; t <= 150; t += 5) {
      const s = coolantProperties({ fluid: 'water', percentByVolume: 0 }, t)
      expect(s.densityKgM3).toBeGreaterThan(900)
      expect(s.viscosityPaS).toBeGreaterThan(1.5e-4)
      expect(s.source).toMatch(/IF97.*IAPWS 2008/)
    }
    const cold = coolantProperties({ fluid: 'water', percentByVolume: 0 }, -5)
    expect(cold.notes?.join(' ')).toMatch(/below the range/)
  })
})

describe('water against python3-iapws (live)', () => {
  const temperaturesC = [0.5, 10, 20, 30, 40, 50, 60, 70, 80, 90, 95, 99]
  const hot = [105, 110, 120, 130, 140, 150] // liquid at saturation pressure
  let r95: Array<{ rho: number; mu: number }>
  let r97: Array<{ rho: number; mu: number }>
  let visc: number[]
  let r95hot: Array<{ rho: number; mu: number }>
  beforeAll(() => {
    r95 = runReference<{ rho: number; mu: number }>('iapws_reference.py', temperaturesC.map(t => ({ fn: 'iapws95', T: t + 273.15, P: 0.101325 }))).results
    r97 = runReference<{ rho: number; mu: number }>('iapws_reference.py', temperaturesC.map(t => ({ fn: 'iapws97', T: t + 273.15, P: 0.101325 }))).results
    visc = runReference<number>('iapws_reference.py', temperaturesC.map(t => ({ fn: 'viscosity', rho: waterDensity(t), T: t + 273.15 }))).results
    // 0.5 kPa above saturation keeps the reference library on the liquid side
    r95hot = runReference<{ rho: number; mu: number }>('iapws_reference.py', hot.map(t => ({ fn: 'iapws95', T: t + 273.15, P: (saturationPressureKpa(t) + 0.5) / 1000 }))).results
  })

  it('IF97 density equals iapws.IAPWS97 to 1e-9 relative (same formulation)', () => {
    temperaturesC.forEach((t, i) => expect(relativeDifference(waterDensity(t), r97[i]!.rho)).toBeLessThan(1e-9))
  })

  it('IF97 density is within 0.05 kg/m³ of iapws.IAPWS95 (the scientific formulation)', () => {
    temperaturesC.forEach((t, i) => expect(Math.abs(waterDensity(t) - r95[i]!.rho)).toBeLessThan(0.05))
  })

  it('IAPWS 2008 viscosity equals iapws._iapws._Viscosity at the same state to 1e-12 relative', () => {
    temperaturesC.forEach((t, i) => expect(relativeDifference(waterViscosityIapws2008(t + 273.15, waterDensity(t)), visc[i]!)).toBeLessThan(1e-12))
  })

  it('viscosity is within 0.05 % of iapws.IAPWS95 (its density, its viscosity)', () => {
    temperaturesC.forEach((t, i) => expect(relativeDifference(waterViscosity(t), r95[i]!.mu)).toBeLessThan(5e-4))
  })

  it('pressurised liquid 105–150 °C: density within 0.1 kg/m³, viscosity within 0.1 % of IAPWS-95', () => {
    hot.forEach((t, i) => {
      const p = saturationPressureKpa(t) + 0.5
      expect(Math.abs(waterDensity(t, p) - r95hot[i]!.rho)).toBeLessThan(0.1)
      expect(relativeDifference(waterViscosity(t, p), r95hot[i]!.mu)).toBeLessThan(1e-3)
    })
  })
})
