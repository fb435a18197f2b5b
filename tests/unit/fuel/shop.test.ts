// The technician's outputs for a fuel circuit: the shopping list (hose by size and pressure class,
// clamps, adapters, filters, regulator, pump, injectors) and the leak-and-prime procedure. The order
// and the cautions are common practice of the trade; the figures are the drawing's own.
import { describe, expect, it } from 'vitest'
import { analyzeCircuit } from '#shared/engine'
import { leakAndPrimeProcedure, procedureFor, shoppingList, type FuelProcedure, type ProcedureStep } from '#shared/shop'
import type { CircuitDocument } from '#shared/circuit'
import { comp, returnStyle, setFuel, valid, withoutReturn } from './fixtures'

const listOf = (doc: CircuitDocument) => shoppingList(valid(doc), analyzeCircuit(valid(doc)))
const procedureOf = (doc: CircuitDocument): FuelProcedure => leakAndPrimeProcedure(valid(doc), analyzeCircuit(valid(doc)))
const indexOf = (steps: ProcedureStep[], id: string) => {
  const i = steps.findIndex((s) => s.id === id)
  if (i < 0) throw new Error(`no step ${id}: ${steps.map((s) => s.id).join(', ')}`)
  return i
}

describe('shopping list of a fuel circuit', () => {
  it('fuel hose by bore in both unit systems and by pressure class', () => {
    const hose = listOf(returnStyle()).lines.find((l) => l.id === 'hose/j30-r9/7.94')!
    expect(hose.description).toMatch(/SAE J30 R9/)
    expect(hose.description).toMatch(/injection pressure class/)
    // 7.94 mm is 5/16 in (25.4 mm per inch exactly)
    expect(hose.sizes.metric).toMatch(/^7\.94 mm bore/)
    expect(hose.sizes.imperial).toMatch(/^5\/16 in bore/)
    expect(hose.sizes.imperial).toMatch(/psi working/)
    // 4 hoses cut to 5622 mm in all; fuel hose comes off the roll by the 0.5 m: 6 m
    expect(hose.quantity).toBe(6)
    expect(hose.unit).toBe('m')
  })

  it('a low-pressure return hose is listed as the low-pressure class', () => {
    const doc = returnStyle()
    doc.circuit.hoses.find((h) => h.id === 'hose-return')!.material = 'j30-r7'
    const ret = listOf(doc).lines.find((l) => l.id === 'hose/j30-r7/7.94')!
    expect(ret.description).toMatch(/low-pressure class, not for the pressure side/)
  })

  it('clamps for every hose end, two per hose', () => {
    const clamps = listOf(returnStyle()).lines.filter((l) => l.section === 'clamps')
    expect(clamps.reduce((n, l) => n + l.quantity, 0)).toBe(2 * returnStyle().circuit.hoses.length)
    expect(clamps[0]!.description).toMatch(/fuel-injection clamp/i)
  })

  it('pump, filter, regulator, rail and injectors, each with the figure it is bought to', () => {
    const list = listOf(returnStyle())
    const by = (id: string) => list.lines.find((l) => l.id === id)!
    const pump = by('fuel-pump/pump')
    expect(pump.section).toBe('fuel-pump')
    // demand 88.19 L/h × 1.2 = 105.8 L/h (see findings.test.ts)
    expect(pump.sizes.metric).toMatch(/^106 L\/h at 4\.1\d bar/)
    expect(pump.sizes.imperial).toMatch(/^28 US gal\/h at 5\d\.\d psi/) // 105.8 / 3.785411784 = 27.96
    const filter = by('filter/filter')
    expect(filter.section).toBe('filters')
    expect(filter.description).toMatch(/10 µm/)
    expect(filter.notes).toMatch(/pressure side/)
    const reg = by('regulator/regulator')
    expect(reg.sizes.metric).toMatch(/base 3 bar \(300 kPa\)/)
    expect(reg.sizes.imperial).toMatch(/base 43\.5 psi/)
    expect(reg.description).toMatch(/manifold-referenced/)
    expect(reg.notes).toMatch(/rising-rate/) // a 1:1 unit is not what the trade calls rising-rate
    const inj = by('injector/injectors')
    expect(inj.quantity).toBe(4)
    // 550 cc/min × 0.745 g/cc × 60 / 453.59237 g/lb = 54.2 lb/h
    expect(inj.sizes.imperial).toMatch(/^54\.2 lb\/h at 43\.5 psi/)
    expect(by('rail/rail').section).toBe('injectors')
    // the car's own tank is not bought; its new fittings are
    expect(list.lines.some((l) => l.elementIds.includes('tank') && l.section !== 'tank-fittings' && l.section !== 'plugs')).toBe(false)
    expect(list.lines.filter((l) => l.section === 'tank-fittings').map((l) => l.description)).toEqual(
      expect.arrayContaining([expect.stringMatching(/^Bulkhead fitting/), expect.stringMatching(/^Vent valve/)]))
  })

  it('a size step asks for an adapter on the list', () => {
    const doc = returnStyle()
    comp(doc, 'filter', 'fuel-filter').ports[0]!.spigotOdMm = 9.53
    const adapter = listOf(doc).lines.filter((l) => l.section === 'reducers')
    expect(adapter).toHaveLength(1)
    expect(adapter[0]!.sizes.imperial).toMatch(/5\/16 in → spigot 3\/8 in/)
  })

  it('the missing return is named as something still to settle', () => {
    expect(listOf(withoutReturn()).attention.join(' ')).toMatch(/return-style regulator/)
    expect(listOf(returnStyle()).attention).toEqual([])
  })
})

describe('leak-and-prime procedure', () => {
  it('procedureFor gives it for a fuel circuit', () => {
    const doc = returnStyle()
    const p = procedureFor(doc, analyzeCircuit(doc))
    expect(p.available).toBe(true)
    expect(p.kind).toBe('fuel-leak-and-prime')
  })

  it('opens with fire safety, ventilation, eye protection, pressure relief and the maker’s data, before any step', () => {
    const steps = procedureOf(returnStyle()).steps
    const cautions = steps.filter((s) => s.kind === 'caution')
    const text = cautions.map((s) => s.text).join(' ')
    expect(text).toMatch(/extinguisher/)
    expect(text).toMatch(/no smoking|spark/)
    expect(text).toMatch(/doors wide open|outdoors/)
    expect(text).toMatch(/eye protection/)
    expect(text).toMatch(/Relieve the pressure before opening anything/)
    expect(text).toMatch(/makers' data and the local regulations/)
    expect(steps.findIndex((s) => s.kind !== 'caution')).toBe(cautions.length)
  })

  it('primes with the engine off and checks every joint before the first crank', () => {
    const doc = returnStyle()
    const steps = procedureOf(doc).steps
    const keyOn = indexOf(steps, 'prime/key-on')
    expect(steps[keyOn]!.text).toMatch(/without cranking/)
    const start = indexOf(steps, 'warm-up/start')
    for (const h of doc.circuit.hoses) expect(indexOf(steps, `leak-test/${h.id}`)).toBeLessThan(start)
    expect(indexOf(steps, 'leak-test/hold')).toBeLessThan(start)
    expect(keyOn).toBeLessThan(indexOf(steps, `leak-test/${doc.circuit.hoses[0]!.id}`))
  })

  it('tests at the regulator’s base pressure and expects base + boost under boost', () => {
    const p = procedureOf(returnStyle())
    expect(p.figures.testPressureKpa).toBe(300)
    expect(p.figures.fullBoostPressureKpa).toBe(400)
    expect(p.figures.returnStyle).toBe(true)
    expect(p.steps.find((s) => s.id === 'prime/base-pressure')!.text).toMatch(/3 bar \(300 kPa\), 43\.5 psi/)
    expect(p.steps.find((s) => s.id === 'warm-up/boost-pressure')!.text).toMatch(/4 bar \(400 kPa\), 58 psi/)
    const calm = procedureOf(setFuel(returnStyle(), { maxBoostKpa: 0 }))
    expect(calm.figures.fullBoostPressureKpa).toBeNull()
    expect(calm.steps.some((s) => s.id === 'warm-up/boost-pressure')).toBe(false)
  })

  it('says not to prime while the check still finds an error (the return line is not drawn)', () => {
    const steps = procedureOf(withoutReturn()).steps
    const stop = steps.find((s) => s.id === 'caution/errors')!
    expect(stop.text).toMatch(/Do not prime yet/)
    expect(stop.elementIds).toContain('regulator')
    expect(procedureOf(returnStyle()).steps.some((s) => s.id === 'caution/errors')).toBe(false)
  })

  it('step ids are unique and every step names only elements of the drawing', () => {
    const doc = returnStyle()
    const steps = procedureOf(doc).steps
    expect(new Set(steps.map((s) => s.id)).size).toBe(steps.length)
    const ids = new Set([...doc.circuit.components.flatMap((c) => [c.id, ...c.ports.map((p) => p.id)]), ...doc.circuit.hoses.map((h) => h.id)])
    for (const s of steps) for (const id of s.elementIds) expect(ids, `${s.id} names ${id}`).toContain(id)
  })

  it('refuses a coolant circuit', () => {
    const doc = returnStyle()
    doc.circuit.kind = 'coolant'
    expect(() => leakAndPrimeProcedure(doc, analyzeCircuit(returnStyle()))).toThrow(/fuel circuits/)
  })
})
