// What the editor offers in each kind of circuit, and what a new fuel circuit starts from.
import { describe, expect, it } from 'vitest'
import { defaultComponent, paletteGroupsFor, parseCircuitDocument, PART_KINDS } from '#shared/circuit'
import { bsfcToLbPerHpH, kwToHp } from '#shared/physics/fuel'
import { DEFAULT_FUEL_SETTINGS, emptyCircuitSettings } from '#shared/circuit/defaults'

const typesOf = (kind: 'coolant' | 'fuel') => paletteGroupsFor(kind).flatMap((g) => g.types)

describe('the palette follows the circuit kind', () => {
  it('a fuel circuit offers the fuel parts and the shared fittings, no radiator or thermostat', () => {
    const fuel = typesOf('fuel')
    expect(fuel).toEqual(expect.arrayContaining(['fuel-tank', 'in-tank-pump', 'inline-pump', 'fuel-filter', 'fuel-regulator', 'fuel-rail', 'injector', 'bulkhead-fitting', 'tee', 'reducer']))
    expect(fuel).not.toContain('radiator')
    expect(fuel).not.toContain('thermostat')
  })
  it('a coolant circuit offers no fuel part', () => {
    const coolant = typesOf('coolant')
    expect(coolant).toContain('radiator')
    expect(coolant.filter((t) => PART_KINDS[t].group.startsWith('fuel'))).toEqual([])
    expect(coolant).not.toContain('fuel-tank')
  })
  it('a tee placed in a fuel circuit has 5/16 in (7.94 mm) spigots, in a coolant circuit the coolant size', () => {
    const fuelTee = defaultComponent('tee', 'tee-1', { x: 0, y: 0, z: 0 }, new Set(), 'fuel')
    expect(fuelTee.ports.map((p) => p.spigotOdMm)).toEqual([7.94, 7.94, 7.94])
    const coolantTee = defaultComponent('tee', 'tee-1', { x: 0, y: 0, z: 0 }, new Set(), 'coolant')
    expect(coolantTee.ports.every((p) => p.spigotOdMm > 10)).toBe(true)
  })
})

describe('a new fuel circuit', () => {
  it('starts from petrol, about 150 hp at 0.50 lb/(hp·h), 80 % duty and no boost (common practice), and parses', () => {
    const s = emptyCircuitSettings('fuel')
    expect(s.fuel).toEqual(DEFAULT_FUEL_SETTINGS)
    expect(s.coolant).toBeUndefined()
    expect(kwToHp(DEFAULT_FUEL_SETTINGS.targetPowerKw)).toBeCloseTo(147.5, 1)
    expect(bsfcToLbPerHpH(DEFAULT_FUEL_SETTINGS.bsfcGPerKwh)).toBeCloseTo(0.5, 2)
    const doc = { format: 'hosewright.circuit', formatVersion: 1, circuit: { kind: 'fuel', title: 'New', settings: s, components: [], hoses: [] } }
    expect(parseCircuitDocument(doc).ok).toBe(true)
  })
  it('a coolant circuit may not carry fuel settings', () => {
    const s = { ...emptyCircuitSettings('coolant'), fuel: DEFAULT_FUEL_SETTINGS }
    const r = parseCircuitDocument({ format: 'hosewright.circuit', formatVersion: 1, circuit: { kind: 'coolant', title: 'New', settings: s, components: [], hoses: [] } })
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.issues.map((i) => i.message)).toContain('A coolant circuit takes no fuel settings')
  })
})

describe('a pump curve is checked as it is typed', () => {
  it('pressures must rise and flows must not; two or three points', async () => {
    const { correctedFuelDemoDocument } = await import('#shared/demo')
    const doc = correctedFuelDemoDocument()
    const pump = doc.circuit.components.find((c) => c.id === 'pump')!
    if (pump.type !== 'in-tank-pump') throw new Error('demo pump changed')
    pump.params.curve = [{ pressureKpa: 400, flowLph: 200 }, { pressureKpa: 300, flowLph: 250 }]
    const r = parseCircuitDocument(JSON.parse(JSON.stringify(doc)))
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.issues.map((i) => i.message)).toEqual(expect.arrayContaining(['Curve pressures must rise from point to point', 'Curve flow must not rise with pressure']))
    pump.params.curve = [{ pressureKpa: 300, flowLph: 250 }]
    const one = parseCircuitDocument(JSON.parse(JSON.stringify(doc)))
    expect(one.ok).toBe(false)
    if (!one.ok) expect(one.issues.map((i) => i.message)).toContain('A fuel pump curve has two or three points')
  })
})
