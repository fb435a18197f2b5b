// A small, sound coolant loop to start each check's test from, and helpers to bend it out of shape.
import type { CircuitDocument, Component, Hose, Point3, Port } from '#shared/circuit'
import { parseCircuitDocument } from '#shared/circuit'
import { analyzeCircuit, type Finding } from '#shared/engine'

export const pt = (x: number, y: number, z: number): Point3 => ({ x, y, z })

export function port(id: string, role: Port['role'], spigotOdMm: number, offset: Point3, blocked = false): Port {
  return { id, name: id.replace(/-/g, ' '), role, spigotOdMm, offset, blocked }
}

export function hose(id: string, from: string, to: string, bore: number, route: Point3[] = [], material: Hose['material'] = 'j20-r4-radiator'): Hose {
  return {
    id, from: { portId: from, clamp: 'worm-drive' }, to: { portId: to, clamp: 'worm-drive' },
    insideDiameterMm: bore, wallMm: 5, material, params: { route },
  }
}

/**
 * Pump → engine → thermostat → radiator → pump, a bypass from the thermostat to the pump, a vent line
 * from the thermostat to a capped expansion tank on top and a static line from the tank to the pump.
 * It gives no finding at all; every test changes one thing.
 */
export function soundLoop(): CircuitDocument {
  const components: Component[] = [
    { id: 'pump', type: 'water-pump', label: 'Pump', position: pt(0, 0, 100), rotationDeg: 0, volumeL: 0.3, params: {},
      ports: [port('pump-in', 'inlet', 32, pt(-50, 0, 0)), port('pump-bypass', 'inlet', 19, pt(-50, 30, 0)),
        port('pump-static', 'inlet', 16, pt(-50, -30, 0)), port('pump-out', 'outlet', 32, pt(50, 0, 0))] },
    { id: 'engine', type: 'engine', label: 'Engine', position: pt(500, 0, 200), rotationDeg: 0, volumeL: 3,
      params: { resistance: { dropKpa: 12, atFlowLpm: 100 } },
      ports: [port('engine-in', 'inlet', 32, pt(-100, 0, 0)), port('engine-out', 'outlet', 32, pt(100, 0, 100))] },
    { id: 'stat', type: 'thermostat', label: 'Thermostat', position: pt(800, 0, 350), rotationDeg: 0, volumeL: 0.2,
      params: { resistance: { k: 2.5, diameterMm: 32 }, openingTempC: 88, fullOpenTempC: 100, valvedPortId: 'stat-out' },
      ports: [port('stat-in', 'inlet', 32, pt(-50, 0, 0)), port('stat-out', 'outlet', 32, pt(50, 0, 0)),
        port('stat-bypass', 'outlet', 19, pt(0, -50, -50)), port('stat-vent', 'vent', 8, pt(0, 0, 40))] },
    { id: 'rad', type: 'radiator', label: 'Radiator', position: pt(1500, 0, 200), rotationDeg: 0, volumeL: 2.5,
      params: { resistance: { dropKpa: 6, atFlowLpm: 100 } },
      ports: [port('rad-in', 'inlet', 32, pt(0, 0, 150)), port('rad-out', 'outlet', 32, pt(0, 0, -150)),
        port('rad-bleed', 'vent', 8, pt(0, 0, 170), true)] },
    { id: 'tank', type: 'expansion-tank', label: 'Tank', position: pt(800, 200, 700), rotationDeg: 0, volumeL: 1,
      params: { capRatingKpa: 100, resistance: { k: 2.7, diameterMm: 3 } },
      ports: [port('tank-cap', 'fill', 40, pt(0, 0, 100), true), port('tank-vent', 'inlet', 8, pt(0, 0, 50)),
        port('tank-out', 'outlet', 16, pt(0, 0, -100))] },
  ]
  const hoses: Hose[] = [
    hose('h-pump-engine', 'pump-out', 'engine-in', 32),
    hose('h-engine-stat', 'engine-out', 'stat-in', 32),
    hose('h-top', 'stat-out', 'rad-in', 32),
    hose('h-bottom', 'rad-out', 'pump-in', 32),
    hose('h-bypass', 'stat-bypass', 'pump-bypass', 19, [], 'j20-r3-heater'),
    hose('h-vent', 'stat-vent', 'tank-vent', 7.94, [], 'j20-r3-heater'),
    hose('h-static', 'tank-out', 'pump-static', 15.88, [], 'j20-r3-heater'),
  ]
  return {
    format: 'hosewright.circuit',
    formatVersion: 1,
    circuit: {
      kind: 'coolant',
      title: 'Test loop',
      settings: {
        allowance: { percent: 0, perEndMm: 0 },
        datum: 'bench top',
        coolant: {
          mix: { fluid: 'ethylene-glycol', percentByVolume: 50 },
          capRatingKpa: 100, maxCoolantTempC: 105, minAmbientC: -25,
          pump: { mode: 'fixed', flowLpm: 40, atRpm: 3000 },
        },
      },
      components,
      hoses,
    },
  }
}

/** A deep copy to change freely. */
export const clone = <T>(v: T): T => structuredClone(v)

export function comp(doc: CircuitDocument, id: string): Component {
  const c = doc.circuit.components.find((x) => x.id === id)
  if (!c) throw new Error(`no part ${id}`)
  return c
}

export function portOf(doc: CircuitDocument, id: string): Port {
  for (const c of doc.circuit.components) for (const p of c.ports) if (p.id === id) return p
  throw new Error(`no port ${id}`)
}

export function dropHose(doc: CircuitDocument, id: string): void {
  doc.circuit.hoses = doc.circuit.hoses.filter((h) => h.id !== id)
}

/** Parses as the app would, failing the test with the paths if the fixture itself is invalid. */
export function valid(doc: CircuitDocument): CircuitDocument {
  const r = parseCircuitDocument(JSON.parse(JSON.stringify(doc)))
  if (!r.ok) throw new Error(r.issues.map((i) => `${i.path}: ${i.message}`).join('\n'))
  return r.document
}

export const findingsOf = (doc: CircuitDocument): Finding[] => analyzeCircuit(valid(doc)).findings
export const codes = (doc: CircuitDocument): string[] => findingsOf(doc).map((f) => f.code)
export const withCode = (doc: CircuitDocument, code: string): Finding[] => findingsOf(doc).filter((f) => f.code === code)
