// Small circuits for the shop tests, built by hand so every figure in a test can be worked out on paper.
import type { CircuitDocument, Component, Hose, Point3, Port } from '#shared/circuit'
import { parseCircuitDocument } from '#shared/circuit'

export const pt = (x: number, y: number, z: number): Point3 => ({ x, y, z })

export function port(id: string, role: Port['role'], spigotOdMm: number, offset: Point3 = pt(0, 0, 0), blocked = false): Port {
  return { id, name: id.replace(/-/g, ' '), role, spigotOdMm, offset, blocked }
}

export function part(id: string, type: 'generic' | 'tee' | 'reducer', at: Point3, ports: Port[], volumeL = 0): Component {
  return { id, type, label: id.toUpperCase(), position: at, rotationDeg: 0, volumeL, params: {}, ports }
}

export function hose(id: string, from: string, to: string, bore: number, wall: number, material: Hose['material'], extra: Partial<Hose> = {}): Hose {
  return {
    id, from: { portId: from, clamp: 'worm-drive' }, to: { portId: to, clamp: 'worm-drive' },
    insideDiameterMm: bore, wallMm: wall, material, params: { route: [] }, ...extra,
  }
}

/** A coolant document around the given parts and hoses, with the allowance asked for. */
export function documentOf(components: Component[], hoses: Hose[], allowance = { percent: 0, perEndMm: 0 }): CircuitDocument {
  return {
    format: 'hosewright.circuit',
    formatVersion: 1,
    circuit: {
      kind: 'coolant',
      title: 'Bench piece',
      settings: {
        allowance,
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

/** Parses as the app would, so a fixture mistake fails loudly with its paths. */
export function valid(doc: CircuitDocument): CircuitDocument {
  const r = parseCircuitDocument(JSON.parse(JSON.stringify(doc)))
  if (!r.ok) throw new Error(r.issues.map((i) => `${i.path}: ${i.message}`).join('\n'))
  return r.document
}
