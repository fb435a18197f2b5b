import { beforeAll, describe, expect, it } from 'vitest'
import {
  psiToKpa, saturationPressureKpa, saturationPressureMpa, saturationTemperatureC, saturationTemperatureK, STANDARD_ATMOSPHERE_KPA,
} from '#shared/physics'
import { relativeDifference, runReference } from './reference-libraries'

describe('IAPWS-IF97 region 4, official verification values', () => {
  // IAPWS R7-97(2012) Table 35 (computer-program verification of Eq. 30); 9 significant digits given
  it.each([
    [300, 0.353658941e-2],
    [500, 0.263889776e1],
    [600, 0.123443146e2],
  ])('ps(%d K) = %f MPa (IF97 Table 35)', (t, ps) => {
    expect(relativeDifference(saturationPressureMpa(t), ps)).toBeLessThan(1e-8)
  })

  // IAPWS R7-97(2012) Table 36 (verification of Eq. 31)
  it.each([
    [0.1, 0.372755919e3],
    [1, 0.453035632e3],
    [10, 0.584149488e3],
  ])('Ts(%f MPa) = %f K (IF97 Table 36)', (p, ts) => {
    expect(relativeDifference(saturationTemperatureK(p), ts)).toBeLessThan(1e-8)
  })

  it('ps at the critical temperature 647.096 K is the critical pressure 22.064 MPa (IF97 Section 2)', () => {
    expect(saturationPressureMpa(647.096)).toBeCloseTo(22.064, 6)
  })

  it('ps at the triple point 273.16 K is 611.657 Pa (check-values §1, derived from Eq. 30)', () => {
    expect(saturationPressureMpa(273.16) * 1e6).toBeCloseTo(611.657, 2)
  })

  it('Eq. 31 inverts Eq. 30 across the range: both solve the same implicit quadratic (IF97 Eq. 29)', () => {
    for (let t = 273.15; t <= 647; t += 7.3) expect(Math.abs(saturationTemperatureK(saturationPressureMpa(t)) - t)).toBeLessThan(1e-9)
  })

  it('rejects states outside region 4', () => {
    expect(() => saturationPressureMpa(270)).toThrow(RangeError)
    expect(() => saturationPressureMpa(650)).toThrow(RangeError)
    expect(() => saturationTemperatureK(23)).toThrow(RangeError)
  })
})

describe('boiling point of water under a pressure cap (check-values §1 derived rows, IF97 Eq. 31)', () => {
  it('1 atm: 99.974 °C (IAPWS-95 via CoolProp gives 99.9743 °C)', () => {
    expect(Math.abs(saturationTemperatureC(STANDARD_ATMOSPHERE_KPA) - 99.974)).toBeLessThan(0.01)
  })

  it.each([
    [7, 111.27], [10, 115.2], [13, 118.75], [15, 120.95], [16, 122.01], [18, 124.04], [20, 125.97],
  ])('%d psig → %f °C', (psig, tc) => {
    expect(Math.abs(saturationTemperatureC(STANDARD_ATMOSPHERE_KPA + psiToKpa(psig)) - tc)).toBeLessThan(0.006)
  })

  it.each([
    [0.9, 118.82], [1.0, 120.42], [1.1, 121.96], [1.4, 126.25], [1.5, 127.59],
  ])('%f bar gauge → %f °C', (bar, tc) => {
    expect(Math.abs(saturationTemperatureC(STANDARD_ATMOSPHERE_KPA + bar * 100) - tc)).toBeLessThan(0.006)
  })

  it('common practice: a 15 psi cap raises the boiling point to about 250 °F (121 °C)', () => {
    const f = saturationTemperatureC(STANDARD_ATMOSPHERE_KPA + psiToKpa(15)) * 1.8 + 32
    expect(f).toBeGreaterThan(248)
    expect(f).toBeLessThan(252)
  })
})

describe('IF97 region 4 against python3-iapws (live)', () => {
  const temperaturesK = [273.16, 280, 300, 320.5, 350, 373.15, 400, 420, 450, 500, 550, 600, 640]
  const pressuresMpa = [0.001, 0.0101325, 0.05, 0.101325, 0.2, 0.25, 0.5, 1, 2, 5, 10, 20]
  let psat: number[]
  let tsat: number[]
  let version: string
  beforeAll(() => {
    const a = runReference<number>('iapws_reference.py', temperaturesK.map(T => ({ fn: 'psat', T })))
    const b = runReference<number>('iapws_reference.py', pressuresMpa.map(P => ({ fn: 'tsat', P })))
    psat = a.results
    tsat = b.results
    version = a.version
  })

  it('reports the library version it compared with', () => {
    expect(version).toMatch(/^\d+\.\d+/)
  })

  it('saturation pressure agrees with iapws.iapws97._PSat_T to 1e-12 relative', () => {
    temperaturesK.forEach((t, i) => expect(relativeDifference(saturationPressureMpa(t), psat[i]!)).toBeLessThan(1e-12))
  })

  it('saturation temperature agrees with iapws.iapws97._TSat_P to 1e-12 relative', () => {
    pressuresMpa.forEach((p, i) => expect(relativeDifference(saturationTemperatureK(p), tsat[i]!)).toBeLessThan(1e-12))
  })

  it('kPa/°C helpers are the same equations', () => {
    expect(saturationPressureKpa(100)).toBeCloseTo(psat[5]! * 1000, 9)
  })
})
