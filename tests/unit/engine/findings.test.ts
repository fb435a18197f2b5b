// Each layout finding code fires on a small circuit made wrong in one way, and not on the sound loop or
// on the corrected demo build. Trade facts are marked common practice beside the check that uses them.
import { describe, expect, it } from 'vitest'
import { analyzeCircuit } from '#shared/engine'
import { correctedDemoDocument, demoDocument } from '#shared/demo'
import { codes, comp, dropHose, findingsOf, hose, port, portOf, pt, soundLoop, valid, withCode } from './fixtures'

describe('the starting points are clean', () => {
  it('the sound test loop gives no finding', () => {
    expect(findingsOf(soundLoop())).toEqual([])
  })
  it('the corrected demo build gives no finding', () => {
    expect(findingsOf(correctedDemoDocument())).toEqual([])
  })
  it('the demo build as first opened shows its two deliberate faults and nothing else', () => {
    const f = findingsOf(demoDocument())
    expect(f.map((x) => [x.code, x.severity])).toEqual([['open-port', 'error'], ['air-trap', 'warning']])
    expect(f[0]!.elementIds).toContain('engine-third')
    expect(f[0]!.fix.action).toEqual({ type: 'block-port', portId: 'engine-third' })
    expect(f[1]!.elementIds).toContain('heater')
  })
})

describe('open-port', () => {
  // Common practice: a transplanted engine often has three coolant outlets where the new car needs two;
  // the unused one must be blanked.
  const threeOutlets = () => {
    const d = soundLoop()
    comp(d, 'engine').ports.push(port('engine-third', 'outlet', 16, pt(100, 50, 0)))
    return d
  }
  it('an outlet with neither hose nor plug is an error, with a one-click blanking cap', () => {
    const f = withCode(threeOutlets(), 'open-port')
    expect(f).toHaveLength(1)
    expect(f[0]!.severity).toBe('error')
    expect(f[0]!.message).toContain('Engine')
    expect(f[0]!.message).toContain('16 mm')
    expect(f[0]!.fix.action).toEqual({ type: 'block-port', portId: 'engine-third' })
  })
  it('blanking the third outlet clears it', () => {
    const d = threeOutlets()
    portOf(d, 'engine-third').blocked = true
    expect(codes(d)).not.toContain('open-port')
  })
})

describe('dangling-hose', () => {
  it('a hose end on no port is an error; a nearby open port is offered to join', () => {
    const d = soundLoop()
    comp(d, 'engine').ports.push(port('engine-heater', 'outlet', 16, pt(0, 100, 0)))
    d.circuit.hoses.push({ ...hose('h-loose', 'engine-heater', 'engine-heater', 15.88, [], 'j20-r3-heater'), to: { portId: null, point: pt(700, 300, 200), clamp: 'worm-drive' } })
    const f = withCode(d, 'dangling-hose')
    expect(f).toHaveLength(1)
    expect(f[0]!.severity).toBe('error')
    expect(f[0]!.elementIds).toEqual(['h-loose'])
  })
})

describe('dead-leg', () => {
  it('a heater loop joined at one end only is a dead leg', () => {
    const d = soundLoop()
    comp(d, 'engine').ports.push(port('engine-heater', 'outlet', 16, pt(0, 100, 0)))
    d.circuit.components.push({
      id: 'heater', type: 'heater-core', label: 'Heater core', position: pt(400, 400, 200), rotationDeg: 0, volumeL: 0.4, params: {},
      ports: [port('heater-in', 'inlet', 16, pt(0, -50, 0)), port('heater-out', 'outlet', 16, pt(0, 50, 0), true)],
    })
    d.circuit.hoses.push(hose('h-heater', 'engine-heater', 'heater-in', 15.88, [], 'j20-r3-heater'))
    const f = withCode(d, 'dead-leg')
    expect(f).toHaveLength(1)
    expect(f[0]!.message).toContain('heater loop')
    expect(f[0]!.elementIds).toEqual(expect.arrayContaining(['heater', 'h-heater', 'heater-out']))
  })
  it('a tee whose branch ends at a plug is a dead leg; a branch to a bleed valve is not', () => {
    const make = (end: 'blanking-plug' | 'bleed-valve') => {
      const d = soundLoop()
      dropHose(d, 'h-bottom')
      d.circuit.components.push(
        { id: 'tee', type: 'tee', label: 'Tee', position: pt(700, 0, 40), rotationDeg: 0, volumeL: 0.05, params: {},
          ports: [port('tee-a', 'either', 32, pt(50, 0, 0)), port('tee-b', 'either', 32, pt(-50, 0, 0)), port('tee-c', 'either', 16, pt(0, 0, 40))] },
        end === 'blanking-plug'
          ? { id: 'end', type: 'blanking-plug', label: 'Plug', position: pt(700, 0, 300), rotationDeg: 0, volumeL: 0, params: {}, ports: [port('end-p', 'either', 16, pt(0, 0, 0))] }
          : { id: 'end', type: 'bleed-valve', label: 'Bleed', position: pt(700, 0, 300), rotationDeg: 0, volumeL: 0, params: {}, ports: [port('end-p', 'either', 16, pt(0, 0, 0))] },
      )
      d.circuit.hoses.push(hose('h-b1', 'rad-out', 'tee-a', 32), hose('h-b2', 'tee-b', 'pump-in', 32), hose('h-branch', 'tee-c', 'end-p', 15.88, [], 'j20-r3-heater'))
      return d
    }
    const plugged = withCode(make('blanking-plug'), 'dead-leg')
    expect(plugged).toHaveLength(1)
    expect(plugged[0]!.elementIds).toEqual(expect.arrayContaining(['h-branch', 'end']))
    expect(codes(make('bleed-valve'))).not.toContain('dead-leg')
  })
})

describe('no-circulation', () => {
  it('a radiator with no way back to the pump is an error that names it', () => {
    const d = soundLoop()
    dropHose(d, 'h-bottom')
    portOf(d, 'rad-out').blocked = true
    portOf(d, 'pump-in').blocked = true
    const f = withCode(d, 'no-circulation')
    expect(f).toHaveLength(1)
    expect(f[0]!.severity).toBe('error')
    expect(f[0]!.elementIds).toContain('rad')
    expect(f[0]!.message).toContain('Radiator')
    // nothing to solve once coolant cannot go round
    expect(analyzeCircuit(valid(d)).flow.open.solved).toBe(false)
  })
  it('a circuit without a pump is an error', () => {
    const d = soundLoop()
    comp(d, 'pump').type = 'generic'
    expect(codes(d)).toContain('no-circulation')
  })
})

describe('direction-conflict', () => {
  it('an outlet joined to an outlet', () => {
    const d = soundLoop()
    portOf(d, 'pump-bypass').role = 'outlet'
    const f = withCode(d, 'direction-conflict')
    expect(f.some((x) => x.message.includes('two outlets'))).toBe(true)
  })
  it('computed flow leaving a port marked as an inlet', () => {
    const d = soundLoop()
    portOf(d, 'stat-bypass').role = 'inlet'
    const f = withCode(d, 'direction-conflict').filter((x) => x.message.includes('L/min flows out of'))
    expect(f).toHaveLength(1)
    expect(f[0]!.elementIds).toEqual(['stat-bypass', 'h-bypass'])
  })
})

describe('air-trap', () => {
  it('a top hose humped over an obstacle traps air; the fix is a bleed valve at the hump', () => {
    const d = soundLoop()
    d.circuit.hoses.find((h) => h.id === 'h-top')!.params.route = [pt(1000, 0, 350), pt(1150, 0, 600), pt(1300, 0, 350)]
    const f = withCode(d, 'air-trap')
    expect(f).toHaveLength(1)
    expect(f[0]!.fix.action).toEqual({ type: 'add-bleed-valve', hoseId: 'h-top', at: pt(1150, 0, 600) })
  })
  it('a hump smaller than the tolerance is drawing noise, not a trap', () => {
    const d = soundLoop()
    d.circuit.hoses.find((h) => h.id === 'h-top')!.params.route = [pt(1150, 0, 365)]
    expect(codes(d)).not.toContain('air-trap')
  })
  it('a radiator top standing above its hoses traps air without its bleed screw', () => {
    const d = soundLoop()
    comp(d, 'rad').position.z = 300
    expect(codes(d)).not.toContain('air-trap')
    portOf(d, 'rad-bleed').role = 'either'
    const f = withCode(d, 'air-trap')
    expect(f).toHaveLength(1)
    expect(f[0]!.fix.action?.type).toBe('add-vent-port')
  })
})

describe('fill-not-highest', () => {
  it('a radiator mounted above the tank filler', () => {
    const d = soundLoop()
    comp(d, 'rad').position.z = 1000
    const f = withCode(d, 'fill-not-highest')
    expect(f).toHaveLength(1)
    expect(f[0]!.elementIds).toContain('rad')
    expect(f[0]!.fix.action).toMatchObject({ type: 'raise-component', componentId: 'tank' })
    // raising the tank as offered clears it
    const z = (f[0]!.fix.action as { z: number }).z
    comp(d, 'tank').position.z = z
    expect(codes(d)).not.toContain('fill-not-highest')
  })
})

describe('missing parts', () => {
  it('no-pressure-cap when the tank has no cap', () => {
    const d = soundLoop()
    const tank = comp(d, 'tank')
    if (tank.type === 'expansion-tank') delete tank.params.capRatingKpa
    expect(codes(d)).toContain('no-pressure-cap')
  })
  it('no-expansion-space when there is no tank or bottle, and when the tank has too little room', () => {
    const d = soundLoop()
    comp(d, 'tank').type = 'generic'
    ;(comp(d, 'tank') as { params: object }).params = {}
    expect(codes(d)).toContain('no-expansion-space')
    const small = soundLoop()
    const tank = comp(small, 'tank')
    if (tank.type === 'expansion-tank') tank.params.capacityL = tank.volumeL + 0.05
    expect(withCode(small, 'no-expansion-space')[0]!.elementIds).toEqual(['tank'])
  })
  it('no-thermostat', () => {
    const d = soundLoop()
    const t = comp(d, 'stat') as { type: string; params: object }
    t.type = 'thermostat-housing'
    t.params = {}
    expect(codes(d)).toContain('no-thermostat')
  })
  it('cap-rating-mismatch when the fitted cap differs from the settings', () => {
    const d = soundLoop()
    const tank = comp(d, 'tank')
    if (tank.type === 'expansion-tank') tank.params.capRatingKpa = 70
    expect(withCode(d, 'cap-rating-mismatch')[0]!.fix.action).toEqual({ type: 'set-cap-rating', capRatingKpa: 70 })
  })
})

describe('no-warm-up-bypass', () => {
  const noVentLine = () => {
    const d = soundLoop()
    dropHose(d, 'h-vent')
    portOf(d, 'stat-vent').blocked = true
    portOf(d, 'tank-vent').blocked = true
    return d
  }
  it('without a bypass the pump has no way back while the thermostat is shut', () => {
    const d = noVentLine()
    dropHose(d, 'h-bypass')
    portOf(d, 'stat-bypass').blocked = true
    portOf(d, 'pump-bypass').blocked = true
    const f = withCode(d, 'no-warm-up-bypass')
    expect(f).toHaveLength(1)
    expect(f[0]!.message).toContain('no way back')
  })
  it('a bypass taken off before the thermostat leaves its sensing side without flow', () => {
    const d = noVentLine()
    dropHose(d, 'h-bypass')
    portOf(d, 'stat-bypass').blocked = true
    comp(d, 'engine').ports.push(port('engine-bypass', 'outlet', 19, pt(0, -60, 50)))
    d.circuit.hoses.push(hose('h-engine-bypass', 'engine-bypass', 'pump-bypass', 19.05, [], 'j20-r3-heater'))
    const f = withCode(d, 'no-warm-up-bypass')
    expect(f).toHaveLength(1)
    expect(f[0]!.message).toContain('sensing side')
  })
  it('a thermostat with a bypass hole needs no bypass hose', () => {
    const d = noVentLine()
    dropHose(d, 'h-bypass')
    portOf(d, 'stat-bypass').blocked = true
    portOf(d, 'pump-bypass').blocked = true
    const t = comp(d, 'stat')
    if (t.type === 'thermostat') t.params.hasBypass = true
    expect(codes(d)).not.toContain('no-warm-up-bypass')
  })
})

