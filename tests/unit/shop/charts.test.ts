// Chart data: volume by part and flow split by branch.
import { describe, expect, it } from 'vitest'
import { analyzeCircuit } from '#shared/engine'
import { correctedDemoDocument } from '#shared/demo'
import { flowSplit, volumeByPart } from '#shared/shop'
import { documentOf, hose, part, port, pt, valid } from './fixtures'

describe('volumeByPart', () => {
  it('hose volume π/4·d²·L: 1.5 in × 1 m = 1.1401 L, 3/4 in × 1 m = 0.2850 L (check-values §4, derived)', () => {
    const doc = valid(documentOf(
      [
        part('a', 'generic', pt(0, 0, 0), [port('a1', 'either', 38.1), port('a2', 'either', 19.05)], 0.5),
        part('b', 'generic', pt(800, 0, 0), [port('b1', 'either', 38.1), port('b2', 'either', 19.05)]),
      ],
      [
        hose('wide', 'a1', 'b1', 38.1, 6, 'j20-r4-radiator', { measuredLengthMm: 1000 }),
        hose('narrow', 'a2', 'b2', 19.05, 4, 'j20-r3-heater', { measuredLengthMm: 1000 }),
      ],
    ))
    const data = volumeByPart(analyzeCircuit(doc))
    const wide = data.find((d) => d.elementIds.includes('wide'))!
    const narrow = data.find((d) => d.elementIds.includes('narrow'))!
    expect(wide.value).toBeCloseTo(1.1401, 4)
    expect(narrow.value).toBeCloseTo(0.285, 4)
    expect(wide.unit).toBe('L')
    // part b holds nothing and is left out; part a's 0.5 L is its own bar
    expect(data.map((d) => d.value)).toHaveLength(3)
    expect(data.find((d) => d.label === 'A')!.value).toBe(0.5)
  })
  it('demo: hoses grouped by material and bore, the parts each on their own, and it all adds up to the system volume', () => {
    const report = analyzeCircuit(correctedDemoDocument())
    const data = volumeByPart(report)
    expect(data.reduce((s, d) => s + d.value, 0)).toBeCloseTo(report.quantities.volume.totalL, 9)
    const hoseGroups = data.filter((d) => d.label.includes('hose') || d.label.includes('hard line'))
    expect(hoseGroups).toHaveLength(report.quantities.hoseTotals.length)
    for (let i = 1; i < data.length; i++) expect(data[i - 1]!.value).toBeGreaterThanOrEqual(data[i]!.value)
  })
})

describe('flowSplit', () => {
  it('gives every branch but the pump, for the thermostat open and shut, with the engine\'s flows', () => {
    const report = analyzeCircuit(correctedDemoDocument())
    const data = flowSplit(report)
    for (const [state, series] of [['open', 'thermostat open'], ['closed', 'thermostat shut']] as const) {
      const flow = report.flow[state]
      if (!flow.solved) throw new Error(`${state} not solved`)
      const expected = flow.branches.filter((b) => b.kind !== 'pump').map((b) => b.flowLpm)
      expect(data.filter((d) => d.series === series).map((d) => d.value)).toEqual(expected)
    }
    expect(data.every((d) => d.unit === 'L/min')).toBe(true)
    // the demo thermostat has no bleed hole: the radiator carries flow with it open and none with it shut
    expect(data.some((d) => d.series === 'thermostat open' && d.elementIds.includes('radiator') && d.value > 1)).toBe(true)
    expect(data.some((d) => d.series === 'thermostat shut' && d.elementIds.includes('radiator') && d.value > 0.1)).toBe(false)
  })
  it('a circuit that cannot circulate gives no flow data', () => {
    const doc = valid(documentOf([part('a', 'generic', pt(0, 0, 0), [port('a1', 'either', 16)]), part('b', 'generic', pt(500, 0, 0), [port('b1', 'either', 16)])],
      [hose('h', 'a1', 'b1', 15.88, 4, 'j20-r3-heater')]))
    expect(flowSplit(analyzeCircuit(doc))).toEqual([])
  })
})
