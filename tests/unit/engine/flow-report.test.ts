// The flow section of the report: where the pressure goes (hose losses, part drops) and what each
// branch of the split is.
import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { analyzeCircuit, formatReportText, type FlowReport } from '#shared/engine'
import { demoDocument, randomCircuit } from '#shared/demo'
import type { CircuitDocument } from '#shared/circuit'
import { coolantProperties, darcyPressureDropPerMetre } from '#shared/physics'
import { comp, hose, port, pt, soundLoop, valid } from './fixtures'

type Solved = Extract<FlowReport, { solved: true }>

function solved(doc: CircuitDocument, state: 'open' | 'closed'): Solved {
  const f = analyzeCircuit(doc).flow[state]
  if (!f.solved) throw new Error(`not solved: ${f.reason}`)
  return f
}

/**
 * Follows the coolant from the pump's outlet back to its inlet, taking at each part one of the hoses
 * it leaves by (pick chooses which), and adds up every loss on the way: each hose's own loss and the
 * losses of the part paths at its two ends. Read from the report and the document alone.
 */
function lossesAlongAFlowPath(doc: CircuitDocument, f: Solved, pick: (n: number) => number): number {
  const owner = new Map<string, string>()
  const role = new Map<string, string>()
  for (const c of doc.circuit.components) for (const p of c.ports) { owner.set(p.id, c.id); role.set(p.id, p.role) }
  const pump = doc.circuit.components.find((c) => c.type === 'water-pump')!
  const noise = 1e-9 * f.pumpFlowLpm
  // every hose with flow, as the part it leaves and the part it enters
  const legs = doc.circuit.hoses.flatMap((h) => {
    const hf = f.hoses.find((x) => x.hoseId === h.id)!
    if (!hf.carriesFlow || Math.abs(hf.flowLpm) <= noise) return []
    const forward = hf.flowLpm > 0
    const up = forward ? h.from.portId! : h.to.portId!
    const down = forward ? h.to.portId! : h.from.portId!
    const loss = hf.headLossKpa + (forward ? hf.partLossAtFromKpa + hf.partLossAtToKpa : hf.partLossAtToKpa + hf.partLossAtFromKpa)
    return [{ upPort: up, downPort: down, up: owner.get(up)!, down: owner.get(down)!, loss }]
  })
  // leave the pump by its outlet side; arrive back by its inlet side (pump ports marked outlet are its discharge)
  let legsOut = legs.filter((l) => l.up === pump.id && role.get(l.upPort) === 'outlet')
  let total = 0
  for (let steps = 0; steps < 10_000; steps++) {
    const leg = legsOut[pick(legsOut.length) % legsOut.length]!
    total += leg.loss
    if (leg.down === pump.id && role.get(leg.downPort) !== 'outlet') return total
    legsOut = legs.filter((l) => l.up === leg.down)
    if (legsOut.length === 0) throw new Error(`the flow stops at ${leg.down}`)
  }
  throw new Error('the path does not come back to the pump')
}

describe('where the pressure goes', () => {
  const demo = valid(demoDocument())

  it('the pump rise equals the losses along every flow path from its outlet back to its inlet (demo, both states)', () => {
    for (const state of ['open', 'closed'] as const) {
      const f = solved(demo, state)
      for (let seed = 0; seed < 8; seed++) {
        let s = seed
        const sum = lossesAlongAFlowPath(demo, f, (n) => { s = (s * 7 + 3) % 1009; return s % Math.max(n, 1) })
        // energy balance around a closed loop: heads cancel, so the losses add up to the pump's head
        expect(Math.abs(sum - f.pumpRiseKpa)).toBeLessThan(1e-6 * f.pumpRiseKpa)
      }
    }
  })

  it('the same on random circuits, along randomly chosen flow paths', () => {
    const circuits = fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), rungs: fc.integer({ min: 1, max: 6 }), faults: fc.boolean(), tidy: fc.boolean() })
    fc.assert(fc.property(circuits, fc.array(fc.nat(), { minLength: 1, maxLength: 40 }), (opts, choices) => {
      const doc = valid(randomCircuit(opts))
      for (const state of ['open', 'closed'] as const) {
        const f = analyzeCircuit(doc).flow[state]
        if (!f.solved || f.pumpFlowLpm === 0) continue
        let k = 0
        const sum = lossesAlongAFlowPath(doc, f, (n) => choices[k++ % choices.length]! % Math.max(n, 1))
        expect(Math.abs(sum - f.pumpRiseKpa)).toBeLessThan(1e-6 * Math.max(1, f.pumpRiseKpa))
      }
    }), { numRuns: 40 })
  })

  it('a hose reports its own friction and bends; the 3 mm restrictor of the tank shows as the tank’s drop', () => {
    // Thermostat shut: the 7.94 mm vent line to the tank runs at about 1 m/s. Its own loss is a
    // Darcy–Weisbach figure (check-values §4 formula, friction from our Colebrook) plus one gentle bend;
    // the large drop belongs to the tank, whose vent inlet has K 2.7 at 3 mm.
    const report = analyzeCircuit(demo)
    const f = solved(demo, 'closed')
    const vent = demo.circuit.hoses.find((h) => h.id === 'hose-vent')!
    const hf = f.hoses.find((h) => h.hoseId === 'hose-vent')!
    const lengthM = report.quantities.hoses.find((h) => h.hoseId === 'hose-vent')!.baseLengthMm / 1000
    expect(hf.velocityMS).toBeGreaterThan(0.8)
    const fluid = coolantProperties(demo.circuit.settings.coolant!.mix, f.temperatureC)
    const straight = darcyPressureDropPerMetre(Math.abs(hf.flowLpm), vent.insideDiameterMm / 1000, 1e-5, fluid)
    expect(hf.headLossKpa).toBeGreaterThan((0.9 * straight.pressureDropPaPerM * lengthM) / 1000)
    expect(hf.headLossKpa).toBeLessThan((straight.pressureDropPaPerM * lengthM * 1.2 + straight.velocityPressurePa) / 1000)
    expect(hf.headLossKpa).toBeLessThan(2)
    const tank = f.parts.find((p) => p.componentId === 'tank')!
    expect(tank.dropKpa).toBeGreaterThan(20 * hf.headLossKpa)
  })

  it('a two-port part drops its rated drop scaled with flow², plus exit and entrance losses at its spigots', () => {
    // The radiator: 6 kPa at 100 L/min (a rated drop scales with Q²), its top tank inlet an exit
    // (K 1.0) and its bottom outlet a sharp entrance (K 0.5), Crane TP-410, each K·ρv²/2 at the hose bore.
    const f = solved(demo, 'open')
    const rad = f.parts.find((p) => p.componentId === 'radiator')!
    const top = f.hoses.find((h) => h.hoseId === 'hose-top')!
    const bore = 0.03175
    const rho = f.fluid.densityKgM3
    const v = Math.abs(top.flowLpm) / 60000 / ((Math.PI / 4) * bore * bore)
    const expected = 6 * (rad.flowLpm / 100) ** 2 + (1.5 * rho * v * v) / 2 / 1000
    expect(rad.dropKpa).toBeCloseTo(expected, 9)
    expect(rad.flowLpm).toBeCloseTo(Math.abs(top.flowLpm), 9)
  })
})

describe('the branches of the split', () => {
  const demo = valid(demoDocument())

  it('every branch says what it is: a kind and the parts along it in the direction of flow', () => {
    for (const state of ['open', 'closed'] as const) {
      const f = solved(demo, state)
      const label = (id: string) => demo.circuit.components.find((c) => c.id === id)!.label
      for (const b of f.branches) {
        expect(['pump', 'radiator', 'heater', 'bypass', 'vent', 'feed', 'return', 'run']).toContain(b.kind)
        expect(b.label.startsWith(label(b.fromComponentId))).toBe(true)
        expect(b.label.endsWith(label(b.toComponentId))).toBe(true)
        for (const id of b.componentIds) expect(b.label).toContain(label(id))
      }
    }
    const open = solved(demo, 'open')
    const row = (kind: string) => open.branches.filter((b) => b.kind === kind).map((b) => b.label)
    expect(row('return')).toEqual(['Return tee (tank line) → Water pump (belt driven)'])
    expect(row('run')).toEqual(['Engine (turbo four) → Inline thermostat housing'])
    expect(row('radiator')).toEqual(['Inline thermostat housing → Front radiator → Return tee (tank line)'])
  })

  it('shares are of the pump flow, and the branches leaving a part add up to those reaching it (demo)', () => {
    const f = solved(demo, 'open')
    const share = (kind: string) => f.branches.filter((b) => b.kind === kind).reduce((s, b) => s + b.shareOfPump, 0)
    expect(share('pump')).toBeCloseTo(1, 12)
    // at the engine the pump's flow splits into the heater and the run to the thermostat housing
    expect(share('heater') + share('run')).toBeCloseTo(1, 9)
    // side by side between the thermostat housing and the pump: radiator, bypass, vent line and heater
    expect(share('radiator') + share('bypass') + share('vent') + share('heater')).toBeCloseTo(1, 9)
    expect(f.branches[0]!.kind).toBe('pump')
  })

  it('on random circuits the shares balance at every junction', () => {
    const circuits = fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), rungs: fc.integer({ min: 1, max: 8 }), faults: fc.boolean(), tidy: fc.boolean() })
    fc.assert(fc.property(circuits, (opts) => {
      const report = analyzeCircuit(valid(randomCircuit(opts)))
      for (const f of [report.flow.open, report.flow.closed]) {
        if (!f.solved || f.pumpFlowLpm === 0) continue
        const balance = new Map<string, number>()
        for (const b of f.branches) {
          balance.set(b.fromComponentId, (balance.get(b.fromComponentId) ?? 0) - b.shareOfPump)
          balance.set(b.toComponentId, (balance.get(b.toComponentId) ?? 0) + b.shareOfPump)
        }
        for (const [, net] of balance) expect(Math.abs(net)).toBeLessThan(1e-6)
        expect(f.branches.filter((b) => b.kind === 'pump')).toHaveLength(1)
        expect(f.branches[0]!.shareOfPump).toBeCloseTo(1, 9)
      }
    }), { numRuns: 40 })
  })

  it('the text report names every branch and gives hose and part figures separately', () => {
    const text = formatReportText(analyzeCircuit(demo), demo.circuit.title)
    expect(text).toContain('main return')
    expect(text).toContain('Return tee (tank line) → Water pump (belt driven) (H3)')
    expect(text).not.toMatch(/^ {4}other /m)
    expect(text).toContain('Front radiator: ')
    expect(text).toMatch(/H8 .* loss 0\.\d\d kPa/)
  })
})

describe('a heater valve turned off', () => {
  it('shuts its line in the flow solve only: no flow through it, and no dead-leg finding', () => {
    // the sound loop's bypass line runs through a heater valve; turned off, the bypass carries nothing
    const d = soundLoop()
    d.circuit.components.push({
      id: 'valve', type: 'heater-valve', label: 'Valve', position: pt(400, -100, 100), rotationDeg: 0, volumeL: 0.02,
      params: { open: false, resistance: { k: 2, diameterMm: 19 } },
      ports: [port('valve-a', 'either', 19, pt(-20, 0, 0)), port('valve-b', 'either', 19, pt(20, 0, 0))],
    })
    d.circuit.hoses.find((h) => h.id === 'h-bypass')!.to = { portId: 'valve-a', clamp: 'worm-drive' }
    d.circuit.hoses.push(hose('h-valve', 'valve-b', 'pump-bypass', 19, [], 'j20-r3-heater'))
    const shut = analyzeCircuit(valid(d))
    for (const f of [shut.flow.open, shut.flow.closed]) {
      if (!f.solved) throw new Error('not solved')
      for (const id of ['h-bypass', 'h-valve']) expect(f.hoses.find((h) => h.hoseId === id)!.carriesFlow).toBe(false)
      expect(f.branches.some((b) => b.kind === 'bypass')).toBe(false)
    }
    expect(shut.findings.map((x) => x.code)).not.toContain('dead-leg')
    // opened, the same line carries the bypass flow
    comp(d, 'valve').params = { open: true, resistance: { k: 2, diameterMm: 19 } }
    const open = analyzeCircuit(valid(d)).flow.closed
    if (!open.solved) throw new Error('not solved')
    expect(open.hoses.find((h) => h.hoseId === 'h-valve')!.flowLpm).toBeGreaterThan(1)
    expect(open.branches.some((b) => b.kind === 'bypass' && b.componentIds.includes('valve'))).toBe(true)
  })
})
