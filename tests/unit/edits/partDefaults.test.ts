// The typical parts a new drawing starts from: sizes against the unit definition and the trade's
// figures, and what the engine makes of a freshly placed part.
import { describe, expect, it } from 'vitest'
import { boreForSpigots, componentTypes, inchMm, PART_KINDS, partGroups, placeComponent } from '#shared/circuit'
import { analyzeCircuit, hoseFit } from '#shared/engine'
import { emptyDoc } from './helpers'

describe('typical parts', () => {
  it('writes inch spigots at 25.4 mm per inch, to the 0.01 mm the drawing keeps', () => {
    // 1 in = 25.4 mm exactly (international yard and pound agreement, 1959; check-values §6)
    expect(inchMm(5 / 8)).toBe(15.88)
    expect(inchMm(1.25)).toBe(31.75)
    expect(inchMm(3 / 4)).toBe(19.05)
  })

  it('uses the SAE J20 nominal sizes for radiator and heater spigots', () => {
    // check-values §5 (J20 nominal IDs, tagged [M] there): 5/8 in heater, 3/4 in bypass, 1-1/4 and 1-1/2 in radiator,
    // and their metric names; 5/16 in (7.94) ≈ 8 mm small vent hose is "interchangeable" (check-values §5, [CP])
    const nominal = [7.94, 8, 15.88, 16, 19.05, 19, 31.75, 32, 38.1, 38]
    const flowPorts = componentTypes.flatMap((t) => PART_KINDS[t].ports.filter((p) => !['vent', 'fill', 'drain'].includes(p.role)))
    for (const p of flowPorts) expect(nominal, `${p.name} ${p.spigotOdMm}`).toContain(p.spigotOdMm)
  })

  it('gives every type a group, a name and ports a drawn hose fits', () => {
    const rule = { looseMm: 0.25, stretchPercent: 8 } // the engine's defaults (docs/engine.md)
    for (const type of componentTypes) {
      const kind = PART_KINDS[type]
      expect(partGroups.map((g) => g.id)).toContain(kind.group)
      expect(kind.ports.length).toBeGreaterThan(0)
      for (const p of kind.ports) expect(hoseFit(boreForSpigots(emptyDoc(), [p.spigotOdMm]), p.spigotOdMm, rule)).toBe('fits')
    }
  })

  it('rates the thermostat and cap as the trade commonly does', () => {
    const stat = placeComponent(emptyDoc(), 'thermostat', { x: 0, y: 0, z: 0 }).doc.circuit.components[0]!
    if (stat.type !== 'thermostat') throw new Error('not a thermostat')
    // common practice (check-values §7): start-to-open 82–92 °C, full open about 10–14 K above it
    expect(stat.params.openingTempC).toBeGreaterThanOrEqual(82)
    expect(stat.params.openingTempC).toBeLessThanOrEqual(92)
    expect(stat.params.fullOpenTempC - stat.params.openingTempC).toBeGreaterThanOrEqual(10)
    expect(stat.params.fullOpenTempC - stat.params.openingTempC).toBeLessThanOrEqual(14)
    const cap = placeComponent(emptyDoc(), 'pressure-cap', { x: 0, y: 0, z: 0 }).doc.circuit.components[0]!
    if (cap.type !== 'pressure-cap') throw new Error('not a cap')
    // common practice (check-values §7): passenger-car caps 0.9–1.1 bar
    expect(cap.params.ratingKpa).toBeGreaterThanOrEqual(90)
    expect(cap.params.ratingKpa).toBeLessThanOrEqual(110)
  })

  it('places an engine whose open ports the engine reports, but not its capped ones', () => {
    const placed = placeComponent(emptyDoc(), 'engine', { x: 0, y: 0, z: 0 })
    const engine = placed.doc.circuit.components[0]!
    expect(engine.ports.map((p) => p.role).sort()).toEqual(['inlet', 'outlet', 'outlet'])
    const open = analyzeCircuit(placed.doc).findings.filter((f) => f.code === 'open-port').map((f) => f.elementIds.find((id) => id !== engine.id))
    expect(open.sort()).toEqual(engine.ports.map((p) => p.id).sort())
    const radiator = placeComponent(emptyDoc(), 'radiator', { x: 0, y: 0, z: 0 }).doc
    const radOpen = analyzeCircuit(radiator).findings.filter((f) => f.code === 'open-port').length
    expect(radOpen).toBe(2) // inlet and outlet; the bleed screw and drain tap come closed
  })
})
