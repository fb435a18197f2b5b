// The exchange document: what parses, what is refused (with every failing path), and exact round trips.
import { describe, expect, it } from 'vitest'
import { formatIssues, formatPath, parseCircuitDocument, portWorldPosition, ID_MAX_LENGTH } from '#shared/circuit'
import { correctedDemoDocument, demoDocument } from '#shared/demo'
import { clone, hose, soundLoop } from './fixtures'

const pathsOf = (input: unknown) => {
  const r = parseCircuitDocument(input)
  if (r.ok) throw new Error('expected the document to be refused')
  return r.issues.map((i) => i.path)
}

describe('valid documents', () => {
  it('the demo and the corrected demo parse', () => {
    expect(parseCircuitDocument(demoDocument()).ok).toBe(true)
    expect(parseCircuitDocument(correctedDemoDocument()).ok).toBe(true)
  })
  it('round-trips exactly through JSON text', () => {
    for (const doc of [demoDocument(), correctedDemoDocument(), soundLoop()]) {
      const text = JSON.stringify(doc)
      const r = parseCircuitDocument(text)
      expect(r.ok).toBe(true)
      if (r.ok) {
        expect(r.document).toEqual(doc)
        // written out again it reads back the same, byte for byte
        const again = JSON.stringify(r.document)
        const r2 = parseCircuitDocument(again)
        expect(r2.ok && JSON.stringify(r2.document)).toBe(again)
      }
    }
  })
  it('accepts a fuel circuit without coolant settings (fuel parts come later)', () => {
    const d = soundLoop()
    d.circuit.kind = 'fuel'
    delete d.circuit.settings.coolant
    d.circuit.components = []
    d.circuit.hoses = []
    expect(parseCircuitDocument(d).ok).toBe(true)
  })
})

describe('refused documents list every failing path', () => {
  it('shape errors: each bad field is named', () => {
    const d = clone(soundLoop()) as unknown as Record<string, any>
    d.formatVersion = 2
    d.circuit.components[0].ports[1].spigotOdMm = -3
    d.circuit.components[1].type = 'carburettor'
    d.circuit.hoses[2].material = 'garden-hose'
    d.circuit.hoses[3].to.clamp = 'zip-tie'
    d.circuit.settings.coolant.pump = { mode: 'curve', atRpm: 3000, points: [{ flowLpm: 0, headM: 5 }] }
    d.circuit.components[2].position.z = Infinity
    d.circuit.hoses[4].extra = true
    expect(pathsOf(d).sort()).toEqual([
      'circuit.components[0].ports[1].spigotOdMm',
      'circuit.components[1].type',
      'circuit.components[2].position.z',
      'circuit.hoses[2].material',
      'circuit.hoses[3].to.clamp',
      'circuit.hoses[4]',
      'circuit.settings.coolant.pump.points',
      'formatVersion',
    ])
  })
  it('cross references: duplicate ids, missing ports, a port with two hoses, blocked ports, long ids', () => {
    const d = soundLoop()
    d.circuit.hoses[3]!.to.portId = 'nowhere'
    d.circuit.hoses[1]!.id = d.circuit.hoses[0]!.id
    d.circuit.hoses.push(hose('h-extra', 'rad-bleed', 'engine-in', 8))
    d.circuit.components[4]!.ports[0]!.id = 'x'.repeat(ID_MAX_LENGTH + 1)
    const r = parseCircuitDocument(d)
    expect(r.ok).toBe(false)
    // the long id is a shape error, so it is reported alone first
    expect(!r.ok && r.issues.map((i) => i.path)).toEqual(['circuit.components[4].ports[0].id'])
    d.circuit.components[4]!.ports[0]!.id = 'tank-cap'
    const issues = !r.ok ? (parseCircuitDocument(d) as { issues: { path: string; message: string }[] }).issues : []
    expect(issues.map((i) => i.path)).toEqual([
      'circuit.hoses[1].id',
      'circuit.hoses[3].to.portId',
      'circuit.hoses[7].from.portId',
      'circuit.hoses[7].to.portId',
    ])
    expect(formatIssues(issues)[1]).toBe('circuit.hoses[3].to.portId: No port has the id "nowhere"')
    expect(issues[2]!.message).toContain('blocked')
    expect(issues[3]!.message).toContain('already has a hose')
  })
  it('free ends need a point; thermostat valve port and temperatures must agree', () => {
    const d = soundLoop() as any
    d.circuit.hoses[0].to = { portId: null, clamp: 'spring' }
    d.circuit.components[2].params.valvedPortId = 'rad-in'
    d.circuit.components[2].params.fullOpenTempC = 80
    expect(pathsOf(d)).toEqual([
      'circuit.components[2].params.valvedPortId',
      'circuit.components[2].params.fullOpenTempC',
      'circuit.hoses[0].to.point',
    ])
  })
  it('a coolant circuit needs coolant settings; a pump curve must fall with flow', () => {
    const d = soundLoop() as any
    d.circuit.settings.coolant.pump = { mode: 'curve', atRpm: 3000, points: [{ flowLpm: 0, headM: 5 }, { flowLpm: 50, headM: 6 }, { flowLpm: 40, headM: 1 }] }
    expect(pathsOf(d)).toEqual(['circuit.settings.coolant.pump.points[1].headM', 'circuit.settings.coolant.pump.points[2].flowLpm'])
    delete d.circuit.settings.coolant
    expect(pathsOf(d)).toEqual(['circuit.settings.coolant'])
  })
  it('text that is not JSON is one issue at the document', () => {
    expect(pathsOf('{"format": ')).toEqual(['(document)'])
  })
  it('paths are written with dots and brackets', () => {
    expect(formatPath(['circuit', 'hoses', 3, 'to', 'portId'])).toBe('circuit.hoses[3].to.portId')
    expect(formatPath([])).toBe('(document)')
  })
})

describe('port positions', () => {
  it('turn with the part about z and add its height', () => {
    const w = portWorldPosition({ position: { x: 100, y: 200, z: 300 }, rotationDeg: 90 }, { offset: { x: 10, y: 0, z: 5 } })
    expect(w.x).toBeCloseTo(100, 9)
    expect(w.y).toBeCloseTo(210, 9)
    expect(w.z).toBe(305)
  })
})
