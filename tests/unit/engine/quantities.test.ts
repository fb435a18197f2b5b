// Shopping-list and volume figures against hand-worked examples.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { analyzeCircuit, boreVolumeL, cutLengthMm, wormDriveClampFor } from '#shared/engine'
import { naturalCompare } from '#shared/engine/quantities/parts'
import { correctedDemoDocument } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { hose, port, pt, soundLoop, valid } from './fixtures'

/** Two bare parts and one hose between them, for length and clamp sums. */
function twoParts(route: { x: number; y: number; z: number }[], measured?: number): CircuitDocument {
  const d = soundLoop()
  d.circuit.settings.allowance = { percent: 5, perEndMm: 25 }
  d.circuit.components = [
    { id: 'a', type: 'generic', label: 'A', position: pt(0, 0, 0), rotationDeg: 0, volumeL: 0, params: {}, ports: [port('a1', 'either', 16, pt(0, 0, 0))] },
    { id: 'b', type: 'generic', label: 'B', position: pt(300, 400, 0), rotationDeg: 0, volumeL: 0, params: {}, ports: [port('b1', 'either', 16, pt(0, 0, 0))] },
  ]
  const h = hose('h', 'a1', 'b1', 15.88, route, 'j20-r3-heater')
  h.wallMm = 4
  if (measured !== undefined) h.measuredLengthMm = measured
  d.circuit.hoses = [h]
  return d
}

describe('hose bore volume π/4·d²·L (check-values §4, derived)', () => {
  it('1.5 in × 1 m = 1.1401 L, 3/4 in × 1 m = 0.2850 L, 5/8 in × 1 m = 0.1979 L', () => {
    expect(boreVolumeL(38.1, 1000)).toBeCloseTo(1.1401, 4)
    expect(boreVolumeL(19.05, 1000)).toBeCloseTo(0.285, 4)
    expect(boreVolumeL(15.875, 1000)).toBeCloseTo(0.1979, 4)
  })
})

describe('hose lengths', () => {
  it('a straight 3-4-5 run is 500 mm; through the corner it is 300 + 400 = 700 mm', () => {
    expect(analyzeCircuit(valid(twoParts([]))).quantities.hoses[0]!.drawnLengthMm).toBeCloseTo(500, 9)
    expect(analyzeCircuit(valid(twoParts([pt(300, 0, 0)]))).quantities.hoses[0]!.drawnLengthMm).toBeCloseTo(700, 9)
  })
  it('the height counts too: (0,0,0) → (300,0,400) → (300,400,400) is 500 + 400 mm', () => {
    const d = twoParts([pt(300, 0, 400), pt(300, 400, 400)])
    expect(analyzeCircuit(valid(d)).quantities.hoses[0]!.drawnLengthMm).toBeCloseTo(1300, 9)
  })
  it('cut length = length × (1 + 5 %) + 2 × 25 mm, rounded up to the mm; a measured length overrides the drawn one', () => {
    const drawn = analyzeCircuit(valid(twoParts([]))).quantities.hoses[0]!
    expect(drawn.cutLengthMm).toBe(575) // 500 × 1.05 + 50
    const measured = analyzeCircuit(valid(twoParts([], 620))).quantities.hoses[0]!
    expect(measured.baseLengthMm).toBe(620)
    expect(measured.cutLengthMm).toBe(701) // 620 × 1.05 + 50 = 701.0
    expect(cutLengthMm(100.2, 0, 0)).toBe(101)
  })
  it('totals are rounded up the way hose is sold: heater hose to 0.5 m, radiator hose to whole metres', () => {
    const d = soundLoop()
    d.circuit.components = [
      { id: 'a', type: 'generic', label: 'A', position: pt(0, 0, 0), rotationDeg: 0, volumeL: 0, params: {},
        ports: [port('a1', 'either', 16, pt(0, 0, 0)), port('a2', 'either', 16, pt(0, 0, 0)), port('a3', 'either', 32, pt(0, 0, 0))] },
      { id: 'b', type: 'generic', label: 'B', position: pt(1200, 0, 0), rotationDeg: 0, volumeL: 0, params: {},
        ports: [port('b1', 'either', 16, pt(0, 0, 0)), port('b2', 'either', 16, pt(-600, 0, 0)), port('b3', 'either', 32, pt(1100, 0, 0))] },
    ]
    d.circuit.hoses = [hose('h1', 'a1', 'b1', 15.88, [], 'j20-r3-heater'), hose('h2', 'a2', 'b2', 15.88, [], 'j20-r3-heater'), hose('h3', 'a3', 'b3', 32)]
    const totals = analyzeCircuit(valid(d)).quantities.hoseTotals
    const heater = totals.find((t) => t.material === 'j20-r3-heater')!
    expect(heater.cutTotalMm).toBe(1800) // 1200 + 600
    expect(heater.buy).toEqual({ quantity: 2, unit: 'm' })
    const radiator = totals.find((t) => t.material === 'j20-r4-radiator')!
    expect(radiator.cutTotalMm).toBe(2300)
    expect(radiator.buy).toEqual({ quantity: 3, unit: 'm' })
  })
  it('tags H1, H2 … follow the hoses front to back, whatever their ids', () => {
    const tags = analyzeCircuit(valid(correctedDemoDocument())).quantities.hoses.map((h) => h.tag)
    expect(tags).toEqual(tags.map((_, i) => `H${i + 1}`))
  })
})

describe('clamps (SAE J1508 ranges from memory, check-values §5 [M]; common practice: size on the assembled OD, aim mid-range)', () => {
  it('a 16 mm spigot with a 4 mm wall hose is 24 mm over the clamp: size 12 (17–32 mm, mid 24.5)', () => {
    expect(wormDriveClampFor(24)?.size).toBe(12)
    const clamps = analyzeCircuit(valid(twoParts([]))).quantities.clamps
    expect(clamps.map((c) => [c.assembledOdMm, c.size])).toEqual([[24, 'SAE 12 (17–32 mm)'], [24, 'SAE 12 (17–32 mm)']])
  })
  it('52 mm takes size 32 (40–64, mid 52); 130 mm fits no listed size', () => {
    expect(wormDriveClampFor(52)?.size).toBe(32)
    expect(wormDriveClampFor(130)).toBeNull()
  })
  it('counts clamps by size over the whole circuit', () => {
    const counts = analyzeCircuit(valid(correctedDemoDocument())).quantities.clampCounts
    const worm = counts.filter((c) => c.item === 'worm-drive clamp').reduce((s, c) => s + c.count, 0)
    const d = correctedDemoDocument()
    const ends = d.circuit.hoses.flatMap((h) => [h.from.clamp, h.to.clamp]).filter((k) => k === 'worm-drive').length
    expect(worm).toBe(ends)
  })
})

describe('fittings', () => {
  it('the corrected demo lists the blanking cap on the third outlet, the tee, the bleed valve and the bleed screws', () => {
    const f = analyzeCircuit(valid(correctedDemoDocument())).quantities.fittings
    const line = (item: string) => f.filter((x) => x.item === item).reduce((s, x) => s + x.count, 0)
    expect(line('blanking cap')).toBe(1)
    expect(f.find((x) => x.item === 'blanking cap')!.elementIds).toEqual(['engine-third'])
    expect(line('tee')).toBe(1)
    expect(line('bleed valve')).toBe(1)
    expect(line('bleed screw')).toBe(2)
  })
})

describe('coolant volume and mix', () => {
  it('total = parts + hose bores, shares add up to one', () => {
    const d = valid(soundLoop())
    const q = analyzeCircuit(d).quantities
    const parts = d.circuit.components.reduce((s, c) => s + c.volumeL, 0)
    const hoses = q.hoses.reduce((s, h) => s + boreVolumeL(h.insideDiameterMm, h.baseLengthMm), 0)
    expect(q.volume.totalL).toBeCloseTo(parts + hoses, 12)
    expect(q.volume.parts.reduce((s, p) => s + p.share, 0)).toBeCloseTo(1, 12)
  })
  it('a 50 % mix is half concentrate, half distilled water, and freezes at −37 °C (Engineering ToolBox, check-values §3b)', () => {
    const c = analyzeCircuit(valid(soundLoop())).quantities.coolant!
    expect(c.concentrateL).toBeCloseTo(c.waterL, 12)
    expect(c.freezePointC).toBeCloseTo(-37, 1)
  })
  it('30 % propylene glycol by volume: 0.3 of the fill is concentrate; freezes near −12.8 °C (Lange Table 5.13, check-values §3d)', () => {
    const d = soundLoop()
    d.circuit.settings.coolant!.mix = { fluid: 'propylene-glycol', percentByVolume: 30 }
    d.circuit.settings.coolant!.minAmbientC = -10
    const q = analyzeCircuit(valid(d)).quantities
    expect(q.coolant!.concentrateL).toBeCloseTo(0.3 * q.volume.totalL, 12)
    expect(q.coolant!.freezePointC).toBeCloseTo(-12.8, 1)
  })
  it('plain water grows by ρ(20 °C)/ρ(90 °C) − 1 = 998.207/965.310 − 1 = 3.408 % (IAPWS-95 values, check-values §2)', () => {
    const d = soundLoop()
    const s = d.circuit.settings.coolant!
    s.mix = { fluid: 'water', percentByVolume: 0 }
    s.maxCoolantTempC = 90
    s.minAmbientC = 5
    const q = analyzeCircuit(valid(d)).quantities
    expect(q.coolant!.expansionL / q.volume.totalL).toBeCloseTo(998.207 / 965.31 - 1, 4)
  })
  it('water under a 15 psi (103.42 kPa) cap boils at 120.95 °C (IF97, check-values §1)', () => {
    const d = soundLoop()
    const s = d.circuit.settings.coolant!
    s.mix = { fluid: 'water', percentByVolume: 0 }
    s.capRatingKpa = (15 * 6894.757293168) / 1000
    expect(analyzeCircuit(valid(d)).quantities.coolant!.boilingPointC).toBeCloseTo(120.95, 1)
  })
})

describe('shopping-list order', () => {
  // The reference: split each text into text and number parts, compare part by part (numbers by value,
  // then as written), fewer parts first — the order the lists have always used.
  const reference = (a: string, b: string): number => {
    const pa = a.split(/(\d+(?:\.\d+)?)/)
    const pb = b.split(/(\d+(?:\.\d+)?)/)
    for (let i = 0; i < Math.min(pa.length, pb.length); i++) {
      const x = pa[i]!, y = pb[i]!
      if (x === y) continue
      if (i % 2 === 1) return Number(x) - Number(y) || (x < y ? -1 : 1)
      return x < y ? -1 : 1
    }
    return pa.length - pb.length
  }
  it('naturalCompare orders like the part-by-part comparison, on any texts', () => {
    const text = fc.string({ unit: fc.constantFrom('0', '1', '2', '8', '9', '.', 'a', 'b', ' ', '(', '›', 'S'), maxLength: 12 })
    fc.assert(fc.property(text, text, (a, b) => {
      expect(Math.sign(naturalCompare(a, b))).toBe(Math.sign(reference(a, b)))
    }), { numRuns: 5000 })
  })
  it('numbers sort by value: SAE 6 before SAE 12, 8 mm before 15.88 mm', () => {
    expect(naturalCompare('SAE 6 (8–22 mm)', 'SAE 12 (17–32 mm)')).toBeLessThan(0)
    expect(naturalCompare('for 8 mm spigot', 'for 15.88 mm spigot')).toBeLessThan(0)
    expect(naturalCompare('Supply tee 2 › bleed screw', 'Supply tee 10 › bleed screw')).toBeLessThan(0)
  })
})
