// Size fits, flow and fluid-margin findings on the sound test loop bent one way at a time.
import { describe, expect, it } from 'vitest'
import { analyzeCircuit } from '#shared/engine'
import { demoDocument } from '#shared/demo'
import { clone, comp, portOf, soundLoop, valid, withCode } from './fixtures'

describe('size-mismatch (common practice: stretch a hose a little over a larger spigot, never clamp it down on a smaller one)', () => {
  const ventLine = (bore: number, spigot: number) => {
    const d = soundLoop()
    d.circuit.hoses.find((h) => h.id === 'h-vent')!.insideDiameterMm = bore
    portOf(d, 'stat-vent').spigotOdMm = spigot
    portOf(d, 'tank-vent').spigotOdMm = spigot
    return withCode(d, 'size-mismatch')
  }
  it('1/4 in hose (6.35 mm, exact 25.4 mm/in) fits a 6.5 mm spigot', () => {
    expect(ventLine(6.35, 6.5)).toEqual([])
  })
  it('1/4 in hose on an 8 mm spigot does not; the fix names a hose that fits', () => {
    const f = ventLine(6.35, 8)
    expect(f).toHaveLength(2)
    expect(f[0]!.message).toContain('smaller')
    expect(f[0]!.fix.action).toEqual({ type: 'set-hose-bore', hoseId: 'h-vent', insideDiameterMm: 8 })
  })
  it('5/16 in hose (7.94 mm) fits an 8 mm spigot', () => {
    expect(ventLine(7.94, 8)).toEqual([])
  })
  it('10 mm hose on a 3/8 in (9.53 mm) spigot is loose', () => {
    const f = ventLine(10, 9.53)
    expect(f).toHaveLength(2)
    expect(f[0]!.message).toContain('bigger')
  })
  it('different spigots at the two ends call for a reducer with both sizes', () => {
    const d = soundLoop()
    portOf(d, 'tank-vent').spigotOdMm = 12
    const f = withCode(d, 'size-mismatch')
    expect(f).toHaveLength(1)
    expect(f[0]!.fix.action).toEqual({ type: 'add-reducer', hoseId: 'h-vent', end: 'to', hoseBoreMm: 7.94, spigotOdMm: 12 })
  })
})

describe('flow and fluid margins', () => {
  it('high-velocity when the pump flow is pushed through a small bore', () => {
    const d = soundLoop()
    const s = d.circuit.settings.coolant!
    s.pump = { mode: 'fixed', flowLpm: 150, atRpm: 6000 }
    expect(withCode(d, 'high-velocity').map((f) => f.elementIds[0])).toContain('h-bypass')
  })
  it('low-flow when a heater branch is starved', () => {
    const d = soundLoop()
    d.circuit.settings.thresholds = { minBranchFlowLpm: 80 }
    const f = withCode(d, 'low-flow')
    expect(f).toHaveLength(1)
    expect(f[0]!.elementIds).toContain('rad')
  })
  it('boil-margin: plain water with no cap boils at 99.97 °C (IF97 at 101.325 kPa), below 105 °C + 10 K', () => {
    const d = soundLoop()
    const s = d.circuit.settings.coolant!
    s.mix = { fluid: 'water', percentByVolume: 0 }
    s.capRatingKpa = 0
    s.minAmbientC = 5
    const r = analyzeCircuit(valid(d))
    expect(r.findings.filter((x) => x.code === 'boil-margin')).toHaveLength(1)
    // check-values §1: IF97 Ts(101.325 kPa) = 99.974 °C
    expect(r.quantities.coolant!.boilingPointC).toBeCloseTo(99.974, 2)
  })
  it('freeze-risk: plain water freezes at 0 °C, above a −10 °C winter; the fix offers a mix', () => {
    const d = soundLoop()
    const s = d.circuit.settings.coolant!
    s.mix = { fluid: 'water', percentByVolume: 0 }
    s.minAmbientC = -10
    s.maxCoolantTempC = 90
    const f = withCode(d, 'freeze-risk')
    expect(f).toHaveLength(1)
    // Engineering ToolBox (check-values §3b): 20 vol % EG freezes at −8 °C, 30 % at −16 °C, so 25 % is the first 5 % step below −10 °C
    expect(f[0]!.fix.action).toEqual({ type: 'set-coolant-percent', percentByVolume: 25 })
  })
  it('flow-default-resistance note when a part has no resistance of its own', () => {
    const d = soundLoop()
    delete comp(d, 'rad').params.resistance
    expect(withCode(d, 'flow-default-resistance')[0]!.elementIds).toEqual(['rad'])
  })
})

describe('report order', () => {
  it('errors come first, then warnings, then notes', () => {
    const d = clone(demoDocument())
    const sev = analyzeCircuit(valid(d)).findings.map((f) => f.severity)
    expect(sev).toEqual([...sev].sort((a, b) => ['error', 'warning', 'note'].indexOf(a) - ['error', 'warning', 'note'].indexOf(b)))
  })
})
