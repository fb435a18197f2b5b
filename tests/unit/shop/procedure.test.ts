// The fill-and-bleed procedure generated from the drawing.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { analyzeCircuit } from '#shared/engine'
import { correctedDemoDocument, correctedFuelDemoDocument, demoDocument, randomCircuit } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { fillAndBleedProcedure, procedureFor, type CoolantProcedure, type ProcedureStep } from '#shared/shop'

const CAUTION_IDS = ['caution/hot-cap', 'caution/glycol', 'caution/fans-belts', 'caution/hot-surfaces', 'caution/maker-data']

const procedureOf = (doc: CircuitDocument): CoolantProcedure => fillAndBleedProcedure(doc, analyzeCircuit(doc))
const stepById = (steps: ProcedureStep[], id: string): ProcedureStep => {
  const s = steps.find((x) => x.id === id)
  if (!s) throw new Error(`no step ${id}: ${steps.map((x) => x.id).join(', ')}`)
  return s
}

function cautionsFirst(steps: ProcedureStep[]) {
  expect(steps.slice(0, 5).map((s) => s.id)).toEqual(CAUTION_IDS)
  const lastCaution = steps.map((s) => s.kind).lastIndexOf('caution')
  const firstOther = steps.findIndex((s) => s.kind !== 'caution')
  expect(lastCaution).toBeLessThan(firstOther)
}

describe('cautions come first, every time', () => {
  it('on both demo documents, and the error stop follows them on the first one (its third outlet is open)', () => {
    cautionsFirst(procedureOf(correctedDemoDocument()).steps)
    const first = procedureOf(demoDocument()).steps
    cautionsFirst(first)
    expect(first[5]!.id).toBe('caution/errors')
    expect(first[5]!.elementIds).toContain('engine-third')
  })
  it('on random circuits: cautions first, ids unique, "rule of thumb" in the text exactly when flagged', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 10_000 }), fc.integer({ min: 1, max: 4 }), fc.boolean(), (seed, rungs, faults) => {
      const steps = procedureOf(randomCircuit({ seed, rungs, faults })).steps
      cautionsFirst(steps)
      expect(new Set(steps.map((s) => s.id)).size).toBe(steps.length)
      for (const s of steps) expect(s.text.includes('(rule of thumb)'), s.id).toBe(s.ruleOfThumb === true)
    }), { numRuns: 25 })
  })
  it('the cautions name the hot cap, glycol poisoning, fans and belts, hot surfaces and the maker\'s data', () => {
    const text = procedureOf(correctedDemoDocument()).steps.slice(0, 5).map((s) => s.text).join(' ')
    for (const words of [/never open a pressure cap/i, /poisonous/, /children and animals/, /spills/, /fan can start/, /belts/, /burn/, /local codes/, /licensed/]) {
      expect(text).toMatch(words)
    }
  })
})

describe('bleed order by height (part z + port offset z, lowest first)', () => {
  it('corrected demo: radiator bleed screw at 250 + 270 = 520 mm, then the heater bleed screw at 760 + 20 = 780 mm', () => {
    const doc = correctedDemoDocument()
    const p = procedureOf(doc)
    expect(p.figures.bleedOrder).toEqual(['radiator-bleed', 'heater-bleed-screw'])
    const heights = p.figures.bleedOrder.map((id) => {
      const c = doc.circuit.components.find((x) => x.ports.some((q) => q.id === id))!
      return c.position.z + c.ports.find((q) => q.id === id)!.offset.z
    })
    expect(heights).toEqual([520, 780])
    const order = p.steps.filter((s) => s.id.startsWith('bleed/open-')).map((s) => s.elementIds[0])
    expect(order).toEqual(p.figures.bleedOrder)
    expect(stepById(p.steps, 'bleed/open-radiator-bleed').text).toContain('520 mm above the datum')
  })
  it('lifting the radiator above the heater bleed swaps the order', () => {
    const doc = correctedDemoDocument()
    doc.circuit.components.find((c) => c.id === 'radiator')!.position.z = 600 // bleed screw now at 870 mm
    expect(procedureOf(doc).figures.bleedOrder).toEqual(['heater-bleed-screw', 'radiator-bleed'])
  })
  it('the first demo still has its heater air trap: a raise-or-squeeze step, marked rule of thumb, on the heater', () => {
    const trap = procedureOf(demoDocument()).steps.find((s) => s.id.startsWith('bleed/air-trap-'))!
    expect(trap.ruleOfThumb).toBe(true)
    expect(trap.elementIds).toContain('heater')
    expect(trap.text).toMatch(/raise that point or squeeze/)
  })
})

describe('filling, warming up and topping up', () => {
  const doc = correctedDemoDocument()
  const report = analyzeCircuit(doc)
  const p = fillAndBleedProcedure(doc, report)

  it('fills at the expansion tank by its label; a pressurised tank runs with its cap loose, then fitted', () => {
    expect(p.figures.fillerId).toBe('tank')
    expect(p.figures.layout).toBe('pressurised-tank')
    expect(stepById(p.steps, 'fill/where').text).toContain('Expansion tank › filler and pressure cap')
    expect(stepById(p.steps, 'warm-up/start').text).toMatch(/loosely, not sealed/)
    expect(stepById(p.steps, 'warm-up/close').text).toMatch(/fit its cap fully/)
  })
  it('a cap on the filler neck instead: the engine runs with the filler open', () => {
    const d = correctedDemoDocument()
    const tank = d.circuit.components.find((c) => c.id === 'tank')!
    const capped = { ...tank, type: 'pressure-cap' as const, label: 'Filler neck cap', params: { ratingKpa: 100 } }
    d.circuit.components = d.circuit.components.map((c) => (c.id === 'tank' ? capped : c))
    const q = procedureOf(d)
    expect(q.figures.layout).toBe('open-filler')
    expect(stepById(q.steps, 'warm-up/start').text).toMatch(/^Leave Filler neck cap › filler and pressure cap open/)
    expect(q.figures.testPressureKpa).toBe(100)
  })
  it('runs to the thermostat\'s stamped 88 °C (190 °F) and watches the radiator-side hose', () => {
    expect(stepById(p.steps, 'warm-up/thermostat').text).toContain('88 °C (190 °F)')
    expect(stepById(p.steps, 'warm-up/opening').elementIds).toEqual(['hose-top'])
    expect(stepById(p.steps, 'warm-up/opening').ruleOfThumb).toBe(true)
  })
  it('heater to hot and the heater hoses squeezed (rule of thumb)', () => {
    expect(stepById(p.steps, 'prepare/heater-control').elementIds).toEqual(['heater'])
    const squeeze = stepById(p.steps, 'warm-up/squeeze-heater')
    expect(squeeze.ruleOfThumb).toBe(true)
    expect(squeeze.elementIds.sort()).toEqual(['hose-heater-bleed', 'hose-heater-feed'])
  })
  it('expected fill volume is the report\'s system volume, in L and US qt (1 qt = 0.946352946 L)', () => {
    expect(p.figures.fillVolumeL).toBe(report.quantities.volume.totalL)
    expect(p.figures.fillVolumeUsQuarts * 0.946352946).toBeCloseTo(report.quantities.volume.totalL, 9)
    const record = stepById(p.steps, 'top-up/volume')
    expect(record.kind).toBe('record')
    expect(record.text).toContain(`${report.quantities.volume.totalL.toFixed(2)} L`)
  })
})

describe('pressure test (common practice, check-values §7)', () => {
  const p = procedureOf(correctedDemoDocument())
  it('cold, at the cap rating and not above: 110 kPa = 1.1 bar = 15.95 psi, printed 16 psi', () => {
    expect(p.figures.testPressureKpa).toBe(110)
    expect(stepById(p.steps, 'pressure-test/cold').text).toMatch(/engine cold/)
    const pump = stepById(p.steps, 'pressure-test/pump')
    expect(pump.text).toContain('1.1 bar (110 kPa), 16 psi')
    expect(pump.text).toMatch(/not above/)
    expect(pump.ruleOfThumb).toBeUndefined()
  })
  it('hold with no drop over about 2 minutes (some shops 10–15), a stated pass, and the cap on an adapter: rules of thumb', () => {
    const hold = stepById(p.steps, 'pressure-test/hold')
    expect(hold.text).toMatch(/about 2 minutes.*10–15 minutes/)
    expect(hold.ruleOfThumb).toBe(true)
    expect(stepById(p.steps, 'pressure-test/pass').text).toMatch(/^Pass: the gauge holds/)
    expect(stepById(p.steps, 'pressure-test/cap').text).toMatch(/adapter.*±1–2 psi/)
    expect(p.steps.filter((s) => s.phase === 'pressure-test' && s.kind === 'record')).toHaveLength(1)
  })
  it('two caps: the test goes to the lower rating, the one that lifts first', () => {
    const d = correctedDemoDocument()
    d.circuit.components.push({
      id: 'neck-cap', type: 'pressure-cap', label: 'Radiator neck cap', position: { x: 150, y: 0, z: 600 }, rotationDeg: 0, volumeL: 0,
      params: { ratingKpa: 90 }, ports: [],
    })
    expect(procedureOf(d).figures.testPressureKpa).toBe(90)
  })
})

describe('procedureFor switches on the circuit kind', () => {
  it('coolant gives the fill-and-bleed procedure; fuel gives the leak-and-prime procedure', () => {
    expect(procedureFor(correctedDemoDocument(), analyzeCircuit(correctedDemoDocument())).kind).toBe('coolant-fill-and-bleed')
    const fuel = correctedFuelDemoDocument()
    const r = procedureFor(fuel, analyzeCircuit(fuel))
    expect(r.available).toBe(true)
    expect(r.kind).toBe('fuel-leak-and-prime')
    if (r.available) {
      expect(r.steps[0]!.id).toBe('caution/fire')
      expect(r.steps.some((s) => s.phase === 'prime')).toBe(true)
      expect(r.steps.some((s) => s.phase === 'leak-test')).toBe(true)
    }
    expect(() => fillAndBleedProcedure(fuel, analyzeCircuit(fuel))).toThrow(/coolant circuits/)
  })
})
