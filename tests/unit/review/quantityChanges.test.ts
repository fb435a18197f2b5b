import { describe, expect, it } from 'vitest'
import { demoDocument, correctedDemoDocument } from '#shared/demo'
import { polylineLengthMm, portWorldPosition, type CircuitDocument, type Hose } from '#shared/circuit'
import { analyzeCircuit } from '#shared/engine'
import { quantityChanges } from '#shared/review'

// Lengths straight from the geometry: port to route points to port (docs/engine.md, Quantities).
function drawnLength(doc: CircuitDocument, hose: Hose): number {
  const at = (portId: string) => {
    const comp = doc.circuit.components.find((c) => c.ports.some((p) => p.id === portId))!
    return portWorldPosition(comp, comp.ports.find((p) => p.id === portId)!)
  }
  return polylineLengthMm([at(hose.from.portId!), ...hose.params.route, at(hose.to.portId!)])
}
// the demo's allowance: 5 % plus 25 mm per end, rounded up to the whole mm
const cut = (doc: CircuitDocument, hose: Hose) => Math.ceil(drawnLength(doc, hose) * 1.05 + 2 * 25)
// a cylinder: π/4 · d² · L, with d and L in dm to give litres (check-values §4: 1.5 in × 1 m = 1.1401 L)
const boreVolumeL = (doc: CircuitDocument, hose: Hose) => (Math.PI / 4) * (hose.insideDiameterMm / 100) ** 2 * (drawnLength(doc, hose) / 100)

describe('quantity changes between two versions (demo → corrected demo)', () => {
  const before = demoDocument()
  const after = correctedDemoDocument()
  const changes = quantityChanges(analyzeCircuit(before), analyzeCircuit(after))
  const hoseOf = (doc: CircuitDocument, id: string) => doc.circuit.hoses.find((h) => h.id === id)!

  it('lists the re-routed heater return and the new bleed hose, and no other hose', () => {
    expect(changes.hoseCuts.map((h) => h.hoseId).sort()).toEqual(['hose-heater-bleed', 'hose-heater-return'])
    const ret = changes.hoseCuts.find((h) => h.hoseId === 'hose-heater-return')!
    expect(ret.beforeMm).toBe(cut(before, hoseOf(before, 'hose-heater-return')))
    expect(ret.afterMm).toBe(cut(after, hoseOf(after, 'hose-heater-return')))
    const bleed = changes.hoseCuts.find((h) => h.hoseId === 'hose-heater-bleed')!
    expect(bleed).toMatchObject({ beforeMm: null, afterMm: cut(after, hoseOf(after, 'hose-heater-bleed')) })
  })

  it('totals the heater hose of that size again and leaves the other sizes alone', () => {
    const heaterTotal = (doc: CircuitDocument) => doc.circuit.hoses
      .filter((h) => h.material === 'j20-r3-heater' && h.insideDiameterMm === 15.88).reduce((n, h) => n + cut(doc, h), 0)
    expect(changes.hoseTotals).toHaveLength(1)
    expect(changes.hoseTotals[0]).toMatchObject({ material: 'j20-r3-heater', insideDiameterMm: 15.88, beforeMm: heaterTotal(before), afterMm: heaterTotal(after) })
  })

  it('adds the bleed valve’s volume and the hose bore volume difference', () => {
    const hoses = (doc: CircuitDocument, ids: string[]) => ids.reduce((v, id) => v + boreVolumeL(doc, hoseOf(doc, id)), 0)
    const expected = 0.02 + hoses(after, ['hose-heater-return', 'hose-heater-bleed']) - hoses(before, ['hose-heater-return'])
    expect(changes.volume.deltaL).toBeCloseTo(expected, 4)
    expect(changes.volume.afterL - changes.volume.beforeL).toBeCloseTo(expected, 4)
  })

  it('both deliberate faults are gone and nothing new is found', () => {
    expect(changes.findings.removed.map((f) => f.code).sort()).toEqual(['air-trap', 'open-port'])
    expect(changes.findings.added).toEqual([])
    expect(changes.codes).toEqual({ added: [], removed: ['air-trap', 'open-port'] })
  })

  it('a version against itself changes nothing', () => {
    const same = quantityChanges(analyzeCircuit(before), analyzeCircuit(demoDocument()))
    expect(same).toEqual({ hoseCuts: [], hoseTotals: [], volume: { beforeL: same.volume.beforeL, afterL: same.volume.beforeL, deltaL: 0 }, findings: { added: [], removed: [] }, codes: { added: [], removed: [] } })
  })
})
