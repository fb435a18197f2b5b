import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import {
  KG_PER_POUND, KPA_PER_BAR, LITRES_PER_US_GALLON, LITRES_PER_US_QUART, MM_PER_INCH, NEWTONS_PER_POUND_FORCE, PASCALS_PER_PSI,
  STANDARD_ATMOSPHERE_KPA, celsiusToFahrenheit, celsiusToKelvin, fahrenheitToCelsius, formatQuantity, fromDisplay,
  kpaToPsi, psiToKpa, toDisplay, METRIC_PREFERENCES, US_PREFERENCES, type Quantity, type UnitPreferences,
  formatNominalSize, nearestFractionalInch, parseNominalSizeMm, sameNominalSize,
} from '#shared/physics'

describe('exact unit definitions', () => {
  it('inch is 25.4 mm (international yard and pound agreement, 1959: yard = 0.9144 m)', () => {
    expect(MM_PER_INCH).toBe(25.4)
    expect(36 * MM_PER_INCH).toBeCloseTo(914.4, 12)
  })

  it('pound is 0.45359237 kg (same agreement)', () => {
    expect(KG_PER_POUND).toBe(0.45359237)
  })

  it('US gallon is 231 in³ = 3.785411784 L (NIST Handbook 44 App. C)', () => {
    expect(LITRES_PER_US_GALLON).toBe(3.785411784)
    const cubicInchLitres = (MM_PER_INCH / 100) ** 3 // 1 in = 0.254 dm
    expect(231 * cubicInchLitres).toBeCloseTo(LITRES_PER_US_GALLON, 14)
    expect(LITRES_PER_US_QUART * 4).toBe(LITRES_PER_US_GALLON)
  })

  it('psi is 1 lbf/in² = 6894.757293168 Pa (lbf = lb × 9.80665 m/s², standard gravity of the 3rd CGPM)', () => {
    expect(NEWTONS_PER_POUND_FORCE).toBeCloseTo(4.4482216152605, 12)
    expect(Math.abs(PASCALS_PER_PSI - 6894.757293168) / 6894.757293168).toBeLessThan(1e-12)
  })

  it('standard atmosphere is 101 325 Pa (10th CGPM 1954) = 14.69594878 psi, bar is 100 kPa', () => {
    expect(STANDARD_ATMOSPHERE_KPA).toBe(101.325)
    expect(kpaToPsi(STANDARD_ATMOSPHERE_KPA)).toBeCloseTo(14.69594878, 8)
    expect(KPA_PER_BAR).toBe(100)
  })

  it('temperature scales: K = °C + 273.15, °F = 1.8·°C + 32 (ITS-90 conventions)', () => {
    expect(celsiusToKelvin(0)).toBe(273.15)
    expect(celsiusToFahrenheit(100)).toBe(212)
    expect(celsiusToFahrenheit(-40)).toBe(-40)
    expect(fahrenheitToCelsius(32)).toBe(0)
  })

  it('15 psi is 103.421 kPa and 1.1 bar is 15.9542 psi (derived from the definitions)', () => {
    expect(psiToKpa(15)).toBeCloseTo(103.42135939752, 9)
    expect(kpaToPsi(110)).toBeCloseTo(15.9541511503, 9)
  })
})

describe('display conversions', () => {
  const prefs: UnitPreferences[] = [METRIC_PREFERENCES, US_PREFERENCES, { length: 'in', volume: 'L', temperature: 'C', pressure: 'bar', flow: 'gal/min' }]
  const quantities: Quantity[] = ['length', 'volume', 'temperature', 'temperatureDifference', 'pressure', 'flow']

  it('fromDisplay undoes toDisplay for every quantity and preference', () => {
    fc.assert(fc.property(fc.constantFrom(...prefs), fc.constantFrom(...quantities), fc.double({ min: -1e4, max: 1e4, noNaN: true }), (p, q, v) => {
      const back = fromDisplay(q, toDisplay(q, v, p), p)
      expect(Math.abs(back - v)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(v)))
    }))
  })

  it('converts known values', () => {
    expect(toDisplay('length', 25.4, US_PREFERENCES)).toBe(1)
    expect(toDisplay('volume', LITRES_PER_US_QUART * 6, US_PREFERENCES)).toBeCloseTo(6, 12)
    expect(toDisplay('temperature', 120, US_PREFERENCES)).toBe(248)
    expect(toDisplay('temperatureDifference', 10, US_PREFERENCES)).toBe(18)
    expect(toDisplay('pressure', 110, { ...METRIC_PREFERENCES, pressure: 'bar' })).toBeCloseTo(1.1, 14)
    expect(toDisplay('flow', LITRES_PER_US_GALLON * 20, US_PREFERENCES)).toBeCloseTo(20, 12)
    expect(fromDisplay('pressure', 15, US_PREFERENCES)).toBeCloseTo(103.42135939752, 9)
  })

  it('formats with the unit and sensible decimals', () => {
    expect(formatQuantity('temperature', 120.95, METRIC_PREFERENCES)).toBe('121.0 °C')
    expect(formatQuantity('temperature', 120.95, US_PREFERENCES)).toBe('250 °F')
    expect(formatQuantity('pressure', psiToKpa(15), US_PREFERENCES)).toBe('15.0 psi')
    expect(formatQuantity('length', 15.875, US_PREFERENCES)).toBe('0.63 in')
    expect(formatQuantity('flow', 100, METRIC_PREFERENCES, { decimals: 0 })).toBe('100 L/min')
    expect(formatQuantity('temperature', -0.01, METRIC_PREFERENCES)).toBe('0.0 °C')
    expect(formatQuantity('volume', Number.NaN, METRIC_PREFERENCES)).toBe('—')
    expect(formatQuantity('volume', 2.5, METRIC_PREFERENCES, { bare: true })).toBe('2.50')
  })
})

describe('nominal hose sizes', () => {
  it('parses inch fractions, decimals and mm labels', () => {
    expect(parseNominalSizeMm('5/16 in')).toBeCloseTo(7.9375, 12)
    expect(parseNominalSizeMm('5/16"')).toBeCloseTo(7.9375, 12)
    expect(parseNominalSizeMm('1-1/2 in')).toBeCloseTo(38.1, 12)
    expect(parseNominalSizeMm('1 1/2in')).toBeCloseTo(38.1, 12)
    expect(parseNominalSizeMm('0.75 inch')).toBeCloseTo(19.05, 12)
    expect(parseNominalSizeMm('3/8')).toBeCloseTo(9.525, 12)
    expect(parseNominalSizeMm('8 mm')).toBe(8)
    expect(parseNominalSizeMm('9,5mm')).toBe(9.5)
    expect(parseNominalSizeMm('19')).toBe(19)
    expect(parseNominalSizeMm('hose')).toBeNull()
    expect(parseNominalSizeMm('1/0 in')).toBeNull()
    expect(parseNominalSizeMm('')).toBeNull()
  })

  it('labels mm sizes with the nearest 1/16 in (SAE J20 inch sizes; exact conversions of 5/16 in = 7.94 mm etc.)', () => {
    expect(nearestFractionalInch(7.94).label).toBe('5/16 in')
    expect(nearestFractionalInch(8).label).toBe('5/16 in')
    expect(nearestFractionalInch(38.1).label).toBe('1-1/2 in')
    expect(nearestFractionalInch(50.8).label).toBe('2 in')
    expect(nearestFractionalInch(34.93).label).toBe('1-3/8 in')
    expect(nearestFractionalInch(12.7).label).toBe('1/2 in')
    expect(nearestFractionalInch(8).differenceMm).toBeCloseTo(0.0625, 12)
    expect(() => nearestFractionalInch(0)).toThrow()
  })

  it('formats a bore in either system', () => {
    expect(formatNominalSize(15.875, 'in')).toBe('5/8 in')
    expect(formatNominalSize(9.525, 'mm')).toBe('9.5 mm')
    expect(formatNominalSize(19.05, 'mm')).toBe('19 mm')
  })

  it('compares sizes with a stated tolerance (check-values §5: 8 mm vs 5/16 in 0.06 mm apart, 10 mm vs 3/8 in 0.47 mm)', () => {
    expect(sameNominalSize(8, parseNominalSizeMm('5/16 in')!, 0.25)).toBe(true)
    expect(sameNominalSize(10, parseNominalSizeMm('3/8 in')!, 0.25)).toBe(false)
  })
})
