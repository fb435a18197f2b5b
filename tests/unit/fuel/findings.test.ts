// The fuel checks on the demo conversion and small changes to it. The demo asks for 180 kW at
// 365 g/kWh on E10: 180 × 365 / 1000 = 65.7 kg/h; at 0.745 kg/L (0.9 × 0.740 + 0.1 × 0.789, volume
// mixing; densities from memory) that is 88.19 L/h, 1469.8 cc/min, 367.45 cc/min for each of 4 injectors.
import { describe, expect, it } from 'vitest'
import { applyFix } from '#shared/circuit/edits'
import { analyse, codes, comp, hoseOf, returnStyle, setFuel, withCode, withoutReturn } from './fixtures'

describe('no-return-line', () => {
  it('a return-style regulator whose return port is not joined is an error, with a fix that draws the return', () => {
    const doc = withoutReturn()
    const [f, ...rest] = withCode(doc, 'no-return-line')
    expect(rest).toHaveLength(0)
    expect(f!.severity).toBe('error')
    expect(f!.elementIds).toContain('regulator')
    expect(f!.message).toMatch(/return-style/)
    expect(f!.fix.action).toEqual({ type: 'join-ports', fromPortId: 'regulator-return', toPortId: 'return-bulkhead-spigot', label: 'Return line' })
    // the regulator's open return port is reported once, by this finding, not again as an open port
    expect(withCode(doc, 'open-port').flatMap((o) => o.elementIds)).not.toContain('regulator-return')
  })

  it('applying the fix leaves a circuit with no errors, as the drawn return does', () => {
    const doc = withoutReturn()
    const fix = withCode(doc, 'no-return-line')[0]!.fix.action!
    const fixed = applyFix(doc, fix).doc
    expect(fixed.circuit.hoses).toHaveLength(doc.circuit.hoses.length + 1)
    expect(codes(fixed)).not.toContain('no-return-line')
    expect(analyse(fixed).counts.error).toBe(0)
    expect(analyse(returnStyle()).counts.error).toBe(0)
  })

  it('a return line that ends somewhere other than the tank does not count', () => {
    const doc = returnStyle()
    hoseOf(doc, 'hose-return').to = { portId: null, point: { x: 3000, y: -500, z: -60 }, clamp: 'efi-band' }
    const f = withCode(doc, 'no-return-line')
    expect(f).toHaveLength(1)
    expect(f[0]!.message).toMatch(/free end/)
    expect(codes(doc)).toContain('dangling-hose')
  })

  it('a returnless regulator needs no return line', () => {
    const doc = withoutReturn()
    comp(doc, 'regulator', 'fuel-regulator').params.style = 'returnless'
    comp(doc, 'regulator', 'fuel-regulator').ports[2]!.blocked = true
    expect(codes(doc)).not.toContain('no-return-line')
  })
})

describe('regulator reference and boost (common practice: a referenced regulator adds boost 1:1)', () => {
  it('referenced to the manifold, rail pressure is base + boost and the pressure across the injectors stays at base', () => {
    const q = analyse(returnStyle()).quantities.fuel!
    expect(q.regulator!.basePressureKpa).toBe(300) // about 3 bar base (common practice: 3.0 bar, 43.5 psi)
    expect(q.regulator!.railIdleKpa).toBe(300)
    expect(q.regulator!.railFullKpa).toBe(400) // 300 + 100 kPa of boost, 1:1
    expect(q.regulator!.injectorDeltaPFullKpa).toBe(300)
    expect(codes(returnStyle())).not.toContain('regulator-unreferenced')
  })

  it('not referenced, with boost set: a warning with a fix, and the injectors see base − boost', () => {
    const doc = returnStyle()
    comp(doc, 'regulator', 'fuel-regulator').params.reference = 'none'
    const r = analyse(doc)
    const f = r.findings.find((x) => x.code === 'regulator-unreferenced')!
    expect(f.severity).toBe('warning')
    expect(f.fix.action).toEqual({ type: 'set-regulator-reference', componentId: 'regulator', reference: 'manifold' })
    // √((300 − 100) / 300) = 0.816: the injectors flow 82 % of their figure at full boost
    expect(f.message).toMatch(/82 %/)
    expect(r.quantities.fuel!.regulator!.injectorDeltaPFullKpa).toBe(200)
    const fixed = applyFix(doc, f.fix.action!).doc
    expect(codes(fixed)).not.toContain('regulator-unreferenced')
  })

  it('not referenced on an engine without boost is fine', () => {
    const doc = setFuel(returnStyle(), { maxBoostKpa: 0 })
    comp(doc, 'regulator', 'fuel-regulator').params.reference = 'none'
    expect(codes(doc)).not.toContain('regulator-unreferenced')
  })
})

describe('injector-undersized: duty at the target power, flow corrected by √(Δp ratio)', () => {
  it('4 × 550 cc/min at 3 bar with 3 bar across them: 367.45 / 550 = 66.8 % duty, within 80 %', () => {
    const q = analyse(returnStyle()).quantities.fuel!
    expect(q.injectors!.demandPerInjectorCcMin).toBeCloseTo(367.45, 1)
    expect(q.injectors!.dutyPercent).toBeCloseTo(66.81, 1)
    expect(codes(returnStyle())).not.toContain('injector-undersized')
  })

  it('4 × 440 cc/min: 367.45 / 440 = 83.5 % is over the 80 % limit; at least 367.45 / 0.80 = 459.3 cc/min is asked for', () => {
    const doc = returnStyle()
    comp(doc, 'injectors', 'injector').params.ratedFlowCcMin = 440
    const r = analyse(doc)
    expect(r.quantities.fuel!.injectors!.dutyPercent).toBeCloseTo(83.51, 1)
    const f = r.findings.find((x) => x.code === 'injector-undersized')!
    expect(f.severity).toBe('warning')
    expect(f.fix.text).toMatch(/at least 460 cc\/min/)
  })

  it('a rating at 4 bar is corrected down to the 3 bar across them: 500 × √(3/4) = 433 cc/min, 84.9 % duty', () => {
    const doc = returnStyle()
    Object.assign(comp(doc, 'injectors', 'injector').params, { ratedFlowCcMin: 500, ratedPressureKpa: 400 })
    const q = analyse(doc).quantities.fuel!
    expect(q.injectors!.sets[0]!.flowAtFullCcMin).toBeCloseTo(433.01, 1)
    expect(q.injectors!.dutyPercent).toBeCloseTo(84.86, 1)
    expect(codes(doc)).toContain('injector-undersized')
    // the same 500 cc/min rated at 3 bar is enough (73.5 %)
    comp(doc, 'injectors', 'injector').params.ratedPressureKpa = 300
    expect(codes(doc)).not.toContain('injector-undersized')
  })
})

describe('pump-undersized: the pump’s flow at rail pressure + boost against demand with a 20 % margin', () => {
  const weakPump = [{ pressureKpa: 300, flowLph: 120 }, { pressureKpa: 500, flowLph: 80 }]

  it('the demo pump gives about 222 L/h at 4.1 bar against the 88.19 × 1.2 = 105.8 L/h needed', () => {
    const q = analyse(returnStyle()).quantities.fuel!
    expect(q.demand!.volumeLph).toBeCloseTo(88.19, 2)
    expect(q.pump!.requiredLph).toBeCloseTo(105.83, 2)
    expect(q.pump!.full.railPressureKpa).toBe(400)
    expect(q.pump!.full.pumpOutletKpa).toBeGreaterThan(400) // plus the line's drop and the climb
    expect(q.pump!.full.pumpFlowLph).toBeGreaterThan(200)
    expect(codes(returnStyle())).not.toContain('pump-undersized')
  })

  it('a pump of 120 L/h at 3 bar falling to 80 L/h at 5 bar passes without boost and fails with 1 bar of boost', () => {
    // without boost it works at about 3.1 bar: 120 − 0.2 × 13 ≈ 117 L/h ≥ 105.8; with boost at about
    // 4.1 bar (rail 4 bar, climb 7.3 kPa, a little line drop): about 98 L/h < 105.8
    const calm = setFuel(returnStyle(), { maxBoostKpa: 0 })
    comp(calm, 'pump', 'in-tank-pump').params.curve = weakPump
    expect(codes(calm)).not.toContain('pump-undersized')
    const boosted = returnStyle()
    comp(boosted, 'pump', 'in-tank-pump').params.curve = weakPump
    const r = analyse(boosted)
    const f = r.findings.find((x) => x.code === 'pump-undersized')!
    expect(f.severity).toBe('warning')
    // the operating point lies on the curve: flow = 120 − (40 / 200) × (outlet − 300)
    const full = r.quantities.fuel!.pump!.full
    expect(full.pumpFlowLph).toBeCloseTo(120 - 0.2 * (full.pumpOutletKpa - 300), 6)
    expect(full.pumpFlowLph).toBeGreaterThan(95)
    expect(full.pumpFlowLph).toBeLessThan(100)
    expect(f.fix.text).toMatch(/at least 106 L\/h/)
  })

  it('without fuel settings the sizing checks do not run and a note says why', () => {
    const doc = returnStyle()
    delete doc.circuit.settings.fuel
    comp(doc, 'pump', 'in-tank-pump').params.curve = weakPump
    const c = codes(doc)
    expect(c).not.toContain('pump-undersized')
    expect(c).toContain('fuel-demand-incomplete')
  })
})

describe('line-velocity in supply and return', () => {
  it('the demo lines carry about 246 L/h at 1.38 m/s through 7.94 mm: under both limits', () => {
    // v = Q / A = (246.5 / 3.6e6 m³/s) / (π/4 × 0.00794² m²) = 1.38 m/s
    const lines = analyse(returnStyle()).quantities.fuel!.lines
    const ret = lines.find((l) => l.hoseId === 'hose-return')!
    expect(ret.side).toBe('return')
    expect(ret.velocityMS).toBeCloseTo((ret.flowLph / 3.6e6) / (Math.PI / 4 * 0.00794 ** 2), 6)
    expect(ret.velocityMS).toBeCloseTo(1.38, 1)
    expect(lines.find((l) => l.hoseId === 'hose-feed')!.side).toBe('supply')
  })

  it('a 1/4 in (6.35 mm) return runs at about 2.2 m/s, over the 2 m/s return limit; the fix offers a larger bore', () => {
    const doc = returnStyle()
    hoseOf(doc, 'hose-return').insideDiameterMm = 6.35
    const f = withCode(doc, 'line-velocity')
    expect(f).toHaveLength(1)
    expect(f[0]!.elementIds).toEqual(['hose-return'])
    expect(f[0]!.message).toMatch(/return line/)
    expect(f[0]!.fix.action?.type).toBe('set-hose-bore')
  })

  it('a 5 mm pressure line runs at about 3.5 m/s, over the 3 m/s supply limit', () => {
    const doc = returnStyle()
    hoseOf(doc, 'hose-feed').insideDiameterMm = 5
    const f = withCode(doc, 'line-velocity')
    expect(f.map((x) => x.elementIds[0])).toEqual(['hose-feed'])
    expect(f[0]!.message).toMatch(/pressure line/)
  })
})

describe('hose-not-fuel-rated', () => {
  it('heater hose on the feed is an error: a coolant class is not made for fuel', () => {
    const doc = returnStyle()
    hoseOf(doc, 'hose-feed').material = 'j20-r3-heater'
    const f = withCode(doc, 'hose-not-fuel-rated')
    expect(f).toHaveLength(1)
    expect(f[0]!.severity).toBe('error')
    expect(f[0]!.fix.action).toEqual({ type: 'set-hose-material', hoseId: 'hose-feed', material: 'j30-r9' })
  })

  it('low-pressure carburettor hose (SAE J30 R6) is an error on the pressure side and fine on the return', () => {
    const pressure = returnStyle()
    hoseOf(pressure, 'hose-pump-filter').material = 'j30-r6'
    expect(withCode(pressure, 'hose-not-fuel-rated').map((f) => [f.elementIds[0], f.severity])).toEqual([['hose-pump-filter', 'error']])
    const ret = returnStyle()
    hoseOf(ret, 'hose-return').material = 'j30-r7'
    expect(codes(ret)).not.toContain('hose-not-fuel-rated')
  })

  it('on E85, injection hose marked for E10 gets a warning on every hose; PTFE-lined hose does not', () => {
    const doc = setFuel(returnStyle(), { fuel: 'e85' })
    const f = withCode(doc, 'hose-not-fuel-rated')
    expect(f).toHaveLength(doc.circuit.hoses.length)
    expect(f.every((x) => x.severity === 'warning' && /ethanol/.test(x.message))).toBe(true)
    for (const h of doc.circuit.hoses) h.material = 'ptfe-lined'
    expect(codes(doc)).not.toContain('hose-not-fuel-rated')
  })
})

describe('filter-placement', () => {
  it('a coarse 100 µm filter as the only one after the pump leaves the injectors unprotected', () => {
    const doc = returnStyle()
    comp(doc, 'filter', 'fuel-filter').params.micron = 100
    const f = withCode(doc, 'filter-placement')
    expect(f).toHaveLength(1)
    expect(f[0]!.elementIds).toEqual(expect.arrayContaining(['pump', 'rail']))
  })

  it('a fine sock on the in-tank pump’s inlet restricts it', () => {
    const doc = returnStyle()
    comp(doc, 'pump', 'in-tank-pump').params.strainerMicron = 10
    expect(withCode(doc, 'filter-placement').map((f) => f.elementIds)).toEqual([['pump']])
  })

  it('the demo’s 10 µm filter after the pump and 100 µm sock are where they belong', () => {
    expect(codes(returnStyle())).not.toContain('filter-placement')
  })
})

describe('the checks fuel shares with coolant', () => {
  it('a 5/16 in hose on a 10 mm spigot is a size step needing an adapter; on an 8 mm spigot it fits (check-values §5)', () => {
    const wide = returnStyle()
    comp(wide, 'filter', 'fuel-filter').ports[0]!.spigotOdMm = 10
    const f = withCode(wide, 'size-mismatch')
    expect(f).toHaveLength(1)
    expect(f[0]!.fix.action).toMatchObject({ type: 'add-reducer', spigotOdMm: 10, hoseBoreMm: 7.94 })
    const eight = returnStyle()
    comp(eight, 'filter', 'fuel-filter').ports[0]!.spigotOdMm = 8
    expect(codes(eight)).not.toContain('size-mismatch')
  })

  it('an unplugged old pickup on the tank is an open port with a plug offered', () => {
    const doc = returnStyle()
    comp(doc, 'tank', 'fuel-tank').ports[0]!.blocked = false
    const f = withCode(doc, 'open-port')
    expect(f).toHaveLength(1)
    expect(f[0]!.fix.action).toEqual({ type: 'block-port', portId: 'tank-pickup' })
  })

  it('coolant-only checks (air traps, circulation, boiling) stay quiet on a fuel circuit', () => {
    const r = analyse(returnStyle())
    expect(r.findings).toEqual([])
    expect(r.quantities.coolant).toBeNull()
  })
})
