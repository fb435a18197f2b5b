// Both unit systems on the shopping list and in the procedure: exact definitions, nearest fractions.
import { describe, expect, it } from 'vitest'
import { cutLengthInches, inchText, metresText, pressureText, rangeSizes, temperatureText, volumeText, litresToUsGallons, litresToUsQuarts } from '#shared/shop/format'

describe('exact conversions (check-values §6)', () => {
  it('1 US gal = 231 in³ = 3.785411784 L, so 3.785411784 L is 1 gal and 4 qt (NIST Handbook 44 App. C)', () => {
    expect(litresToUsGallons(3.785411784)).toBeCloseTo(1, 12)
    expect(litresToUsQuarts(3.785411784)).toBeCloseTo(4, 12)
    // 231 in³ × 16.387064 cm³/in³ (1 in = 2.54 cm exactly) = 3785.411784 cm³
    expect(231 * 2.54 ** 3 / 1000).toBeCloseTo(3.785411784, 12)
  })
  it('1 L = 1/0.946352946 US qt = 1.0567 qt; a 5 L bottle is 5.28 US qt', () => {
    expect(volumeText(1).imperial).toBe('1.06 US qt')
    expect(volumeText(5).imperial).toBe('5.28 US qt') // 5 / 0.946352946 = 5.2834
  })
  it('1 psi = 6.894757293168 kPa: a 110 kPa cap is 15.954 psi, printed 16 psi; 1.1 bar (check-values §6)', () => {
    expect(pressureText(110)).toEqual({ metric: '1.1 bar (110 kPa)', imperial: '16 psi' })
    // 103.42 kPa is 15.0 psi: 15 × 6.894757293168 = 103.4214 kPa
    expect(pressureText(15 * 6.894757293168).imperial).toBe('15 psi')
    expect(pressureText(100).imperial).toBe('14.5 psi') // 100 / 6.894757 = 14.5038
  })
  it('°F = 1.8 °C + 32: an 88 °C thermostat is 190 °F (190.4), 82 °C is 180 °F (179.6) (check-values §6, §7)', () => {
    expect(temperatureText(88)).toEqual({ metric: '88 °C', imperial: '190 °F' })
    expect(temperatureText(82).imperial).toBe('180 °F')
  })
  it('1 in = 25.4 mm: 10 m of hose is 10000 / 304.8 = 32.81 ft', () => {
    expect(metresText(10)).toEqual({ metric: '10 m', imperial: '32.81 ft' })
  })
})

describe('nearest fractional inch (1/16 in steps), marked ≈ when the metric size is not the fraction', () => {
  it('inch hose bores read as their fraction (check-values §5 nominal IDs, exact conversion)', () => {
    expect(inchText(15.88)).toBe('5/8 in') // 15.875
    expect(inchText(31.75)).toBe('1-1/4 in')
    expect(inchText(38.1)).toBe('1-1/2 in')
    expect(inchText(7.94)).toBe('5/16 in') // 7.9375
  })
  it('metric spigots get the nearest fraction with ≈: 32 mm ≈ 1-1/4 in, 16 mm ≈ 5/8 in, 10 mm ≈ 3/8 in', () => {
    expect(inchText(32)).toBe('≈ 1-1/4 in') // 32 / 25.4 × 16 = 20.16 → 20/16
    expect(inchText(16)).toBe('≈ 5/8 in') // 10.08 → 10/16
    expect(inchText(10)).toBe('≈ 3/8 in') // 6.30 → 6/16
  })
  it('J1508 clamp ranges in inches match the inch column of check-values §5 (from memory)', () => {
    expect(rangeSizes(27, 51).imperial).toBe('≈ 1-1/16–2 in') // table: 1-1/16 – 2 (SAE 24)
    expect(rangeSizes(17, 32).imperial).toBe('≈ 11/16–1-1/4 in') // table: 11/16 – 1-1/4 (SAE 12)
    expect(rangeSizes(8, 22).imperial).toBe('≈ 5/16–7/8 in') // table: 5/16 – 7/8 (SAE 6)
  })
})

describe('cut lengths in inches are rounded up to the next 1/8 in, never short', () => {
  it('575 mm = 22.638 in → 22-3/4 in; 304.8 mm = 12 in exactly stays 12 in', () => {
    expect(cutLengthInches(575)).toBe('22-3/4 in')
    expect(cutLengthInches(304.8)).toBe('12 in')
  })
  it('4153 mm = 163.504 in → 163-5/8 in, with feet from 3 ft up: 13 ft 7-5/8 in', () => {
    expect(cutLengthInches(4153)).toBe('163-5/8 in (13 ft 7-5/8 in)')
  })
})
