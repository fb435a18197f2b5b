// Rounding concentrate and distilled water up to the containers they are sold in.
// Container sizes are common practice: concentrate 1 L, 4 L, 5 L and 1 US gal; water 4 L, 5 L and 1 US gal.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { bestCombination, chooseContainers, describeChoice, DEFAULT_CONCENTRATE_CONTAINERS, DEFAULT_WATER_CONTAINERS, type ContainerChoice } from '#shared/shop/containers'

const describeChoiceText = (c: ContainerChoice | null): string => (c ? describeChoice(c) : 'none')

const metric = DEFAULT_CONCENTRATE_CONTAINERS.filter((c) => c.system === 'metric')

describe('the rule: least total volume covering the need, one system at a time; tie → fewer containers', () => {
  it('8.66 L + 10 % reserve = 9.53 L → 2 × 5 L (10 L); a US shop would need 3 × 1 US gal (11.36 L)', () => {
    // hand-worked: litre sizes can only make whole litres, so 10 L is the least that covers 9.53 L;
    // 5+5, 5+4+1 and 4+4+1+1 all make 10 L, and 5+5 is the fewest containers.
    // 3 US gal = 3 × 3.785411784 = 11.356 L (2 gal = 7.57 L is short).
    const r = chooseContainers(8.66 * 1.1, DEFAULT_CONCENTRATE_CONTAINERS)
    expect(describeChoiceText(r.choice)).toBe('2 × 5 L')
    expect(r.choice!.totalL).toBe(10)
    expect(describeChoiceText(r.alternatives[0] ?? null)).toBe('3 × 1 US gal')
    expect(r.alternatives[0]!.totalL).toBeCloseTo(11.356, 3)
  })
  it('8.66 L with no reserve → 5 L + 4 L = 9 L (not 2 × 5 L = 10 L, not 3 × 4 L = 12 L)', () => {
    expect(describeChoiceText(bestCombination(8.66, metric))).toBe('1 × 5 L + 1 × 4 L')
  })
  it('4.2 L → one 5 L (5 L; 4 L + 1 L is as much but two containers); 3.2 L → 4 L; 0.3 L → 1 L', () => {
    expect(describeChoiceText(bestCombination(4.2, metric))).toBe('1 × 5 L')
    expect(describeChoiceText(bestCombination(3.2, metric))).toBe('1 × 4 L')
    expect(describeChoiceText(bestCombination(0.3, metric))).toBe('1 × 1 L')
  })
  it('distilled water has no 1 L size: 9.53 L → 2 × 5 L; 8.1 L → 5 L + 4 L; 12.5 L → 5 L + 4 L + 4 L (13 L)', () => {
    expect(describeChoiceText(chooseContainers(9.53, DEFAULT_WATER_CONTAINERS).choice)).toBe('2 × 5 L')
    expect(describeChoiceText(chooseContainers(8.1, DEFAULT_WATER_CONTAINERS).choice)).toBe('1 × 5 L + 1 × 4 L')
    // 13 = 5+4+4 (3 containers); 15 = 5+5+5 is more; 12 = 4+4+4 or 5+... is short
    expect(describeChoiceText(chooseContainers(12.5, DEFAULT_WATER_CONTAINERS).choice)).toBe('1 × 5 L + 2 × 4 L')
  })
  it('when the US jugs are the least volume they win: 7.5 L of water → 2 × 1 US gal (7.57 L) beats 2 × 4 L (8 L)', () => {
    expect(describeChoiceText(chooseContainers(7.5, DEFAULT_WATER_CONTAINERS).choice)).toBe('2 × 1 US gal')
  })
})

describe('against an independent brute force over the litre sizes (1, 4, 5 L)', () => {
  it('covers the need and no combination of up to 60 containers covers it with less', () => {
    fc.assert(fc.property(fc.double({ min: 0.01, max: 120, noNaN: true }), (need) => {
      const got = bestCombination(need, metric)!
      expect(got.totalL).toBeGreaterThanOrEqual(need - 1e-9)
      let least = Infinity
      for (let a = 0; a <= 25; a++) for (let b = 0; b <= 31; b++) {
        const rest = need - 5 * a - 4 * b
        const c = Math.max(0, Math.ceil(rest - 1e-9))
        least = Math.min(least, 5 * a + 4 * b + c)
      }
      expect(got.totalL).toBe(least)
    }), { numRuns: 200 })
  })
})
