// The demo build: a 1970s forward-control camper van with a modern turbocharged four-cylinder taken from
// a front-wheel-drive hatchback, fitted in the rear. The radiator stays up front behind the grille, so the
// radiator hoses run about four metres under the floor, and the cab heater sits under the dash.
//
// Two things are left wrong on purpose, so the checks have something to show on first start:
// the engine's third coolant outlet (it fed the hatchback's oil cooler) is left open, and the cab heater
// core is the high point of its loop with no bleed. `correctedDemoDocument()` is the same build with
// both put right.
import type { CircuitDocument, Component, Hose, Point3, Port } from '../circuit'

const p = (x: number, y: number, z: number): Point3 => ({ x, y, z })

function port(id: string, name: string, role: Port['role'], spigotOdMm: number, offset: Point3, blocked = false): Port {
  return { id, name, role, spigotOdMm, offset, blocked }
}

function hose(
  id: string, label: string, from: string, to: string, bore: number, wall: number, material: Hose['material'],
  route: Point3[], clamp: Hose['from']['clamp'] = 'worm-drive',
): Hose {
  return {
    id, from: { portId: from, clamp }, to: { portId: to, clamp },
    insideDiameterMm: bore, wallMm: wall, material, params: { label, route },
  }
}

function components(): Component[] {
  return [
    {
      id: 'engine', type: 'engine', label: 'Engine (turbo four)', position: p(3900, 0, 300), rotationDeg: 0, volumeL: 3.4,
      params: { resistance: { dropKpa: 14, atFlowLpm: 100 } },
      ports: [
        port('engine-inlet', 'block inlet (from pump)', 'inlet', 32, p(150, 200, -60)),
        port('engine-outlet', 'head outlet', 'outlet', 32, p(-200, -150, 200)),
        port('engine-heater', 'heater outlet', 'outlet', 16, p(200, -150, 150)),
        port('engine-third', 'third outlet (oil-cooler feed)', 'outlet', 16, p(250, 150, 50)),
        port('engine-drain', 'block drain', 'drain', 12, p(0, 200, -200), true),
      ],
    },
    {
      id: 'pump', type: 'water-pump', label: 'Water pump (belt driven)', position: p(3600, 150, 240), rotationDeg: 0, volumeL: 0.3,
      params: { drive: 'belt' },
      ports: [
        port('pump-inlet', 'inlet pipe', 'inlet', 32, p(-80, 0, -20)),
        port('pump-heater-return', 'heater return spigot', 'inlet', 16, p(-60, -60, 20)),
        port('pump-bypass', 'bypass spigot', 'inlet', 19, p(-40, -70, 40)),
        port('pump-outlet', 'outlet neck', 'outlet', 32, p(20, 0, 0)),
      ],
    },
    {
      id: 'thermostat', type: 'thermostat', label: 'Inline thermostat housing', position: p(3850, -250, 560), rotationDeg: 90, volumeL: 0.25,
      params: { resistance: { k: 2.5, diameterMm: 32 }, openingTempC: 88, fullOpenTempC: 100, valvedPortId: 'thermostat-radiator' },
      ports: [
        port('thermostat-engine', 'engine side', 'inlet', 32, p(0, 60, -30)),
        port('thermostat-radiator', 'radiator side', 'outlet', 32, p(0, -60, 40)),
        port('thermostat-bypass', 'bypass outlet', 'outlet', 19, p(40, 0, -20)),
        port('thermostat-vent', 'bleed spigot', 'vent', 8, p(-30, 0, 50)),
      ],
    },
    {
      id: 'radiator', type: 'radiator', label: 'Front radiator', position: p(150, 0, 250), rotationDeg: 0, volumeL: 3.0,
      params: { resistance: { dropKpa: 6, atFlowLpm: 100 } },
      ports: [
        port('radiator-inlet', 'top tank inlet', 'inlet', 32, p(40, 300, 250)),
        port('radiator-outlet', 'bottom tank outlet', 'outlet', 32, p(40, -300, -200)),
        port('radiator-bleed', 'bleed screw', 'vent', 8, p(40, -300, 270), true),
        port('radiator-drain', 'drain tap', 'drain', 10, p(40, -300, -240), true),
      ],
    },
    {
      id: 'tank', type: 'expansion-tank', label: 'Expansion tank', position: p(3600, -350, 900), rotationDeg: 0, volumeL: 1.2,
      // the vent inlet has a 3 mm restrictor so only a trickle passes to carry air up
      params: { capRatingKpa: 110, capacityL: 2.5, resistance: { k: 2.7, diameterMm: 3 } },
      ports: [
        port('tank-cap', 'filler and pressure cap', 'fill', 40, p(0, 0, 120), true),
        port('tank-vent', 'vent inlet', 'inlet', 8, p(60, 0, 80)),
        port('tank-outlet', 'bottom outlet', 'outlet', 16, p(0, 0, -100)),
      ],
    },
    {
      id: 'heater', type: 'heater-core', label: 'Cab heater core', position: p(700, 300, 700), rotationDeg: 0, volumeL: 0.4,
      params: { resistance: { dropKpa: 10, atFlowLpm: 10 } },
      ports: [
        port('heater-inlet', 'inlet', 'inlet', 16, p(-80, -60, 40)),
        port('heater-outlet', 'outlet', 'outlet', 16, p(-80, 60, 40)),
      ],
    },
    {
      // a bypass this short and wide would take most of the pump's flow: the workshop fits a restrictor
      id: 'restrictor', type: 'generic', label: 'Bypass restrictor (12 mm orifice)', position: p(3680, -60, 420), rotationDeg: 0, volumeL: 0.01,
      params: { resistance: { k: 2.7, diameterMm: 12 } },
      ports: [
        port('restrictor-in', 'thermostat side', 'either', 19, p(0, -30, 0)),
        port('restrictor-out', 'pump side', 'either', 19, p(0, 30, 0)),
      ],
    },
    {
      id: 'return-tee', type: 'tee', label: 'Return tee (tank line)', position: p(3420, 100, 150), rotationDeg: 0, volumeL: 0.05,
      params: {},
      ports: [
        port('tee-front', 'run, radiator side', 'either', 32, p(-60, 0, 0)),
        port('tee-rear', 'run, pump side', 'either', 32, p(60, 0, 0)),
        port('tee-branch', 'branch from tank', 'either', 16, p(0, 0, 40)),
      ],
    },
  ]
}

/** Under the floor the hoses run along the inside of the chassis rail, 80 mm below the rail top. */
const FLOOR_Z = -80

function hoses(): Hose[] {
  return [
    hose('hose-top', 'Top hose: thermostat to radiator', 'thermostat-radiator', 'radiator-inlet', 31.75, 5, 'j20-r4-radiator', [
      p(3790, -250, 450), p(3500, -200, FLOOR_Z), p(600, 250, FLOOR_Z), p(250, 300, 300),
    ]),
    hose('hose-bottom', 'Bottom hose: radiator to return tee', 'radiator-outlet', 'tee-front', 31.75, 5, 'j20-r4-radiator', [
      p(400, -300, FLOOR_Z), p(3200, 100, FLOOR_Z),
    ]),
    hose('hose-pump-inlet', 'Return tee to pump inlet', 'tee-rear', 'pump-inlet', 31.75, 5, 'j20-r4-radiator', [p(3500, 130, 180)]),
    hose('hose-transfer', 'Pump to block transfer pipe', 'pump-outlet', 'engine-inlet', 30, 1.5, 'hard-line', [p(3700, 260, 240), p(4000, 260, 240)], 'none'),
    hose('hose-engine-thermostat', 'Head outlet to thermostat', 'engine-outlet', 'thermostat-engine', 31.75, 5, 'j20-r4-radiator', [p(3720, -200, 510)]),
    hose('hose-bypass', 'Bypass: thermostat to restrictor', 'thermostat-bypass', 'restrictor-in', 19.05, 4, 'j20-r3-heater', [p(3750, -150, 480)]),
    hose('hose-bypass-pump', 'Bypass: restrictor to pump', 'restrictor-out', 'pump-bypass', 19.05, 4, 'j20-r3-heater', []),
    hose('hose-vent', 'Vent: thermostat bleed to tank', 'thermostat-vent', 'tank-vent', 7.94, 3.5, 'j20-r3-heater', [p(3700, -300, 750)]),
    hose('hose-static', 'Static line: tank to return tee', 'tank-outlet', 'tee-branch', 15.88, 4, 'j20-r3-heater', [p(3500, -100, 500)]),
    hose('hose-heater-feed', 'Heater feed', 'engine-heater', 'heater-inlet', 15.88, 4, 'j20-r3-heater', [
      p(4050, -200, 300), p(3400, -150, FLOOR_Z), p(650, 200, FLOOR_Z), p(620, 240, 600),
    ]),
    hose('hose-heater-return', 'Heater return', 'heater-outlet', 'pump-heater-return', 15.88, 4, 'j20-r3-heater', [
      p(620, 360, 600), p(700, 380, FLOOR_Z), p(3350, 0, FLOOR_Z), p(3540, 80, 220),
    ]),
  ]
}

function document(title: string, comps: Component[], hs: Hose[], notes: string): CircuitDocument {
  return {
    format: 'hosewright.circuit',
    formatVersion: 1,
    circuit: {
      kind: 'coolant',
      title,
      settings: {
        allowance: { percent: 5, perEndMm: 25 },
        datum: 'x from the front face of the front cross-member, rearwards; y from the centre line, to the left; z from the top face of the chassis rails, up',
        thresholds: { boilMarginK: 10, maxVelocityMS: 3, minBranchFlowLpm: 2 },
        coolant: {
          mix: { fluid: 'ethylene-glycol', percentByVolume: 50 },
          capRatingKpa: 110,
          maxCoolantTempC: 110,
          minAmbientC: -30,
          pump: { mode: 'curve', atRpm: 3000, points: [{ flowLpm: 0, headM: 9 }, { flowLpm: 80, headM: 7 }, { flowLpm: 140, headM: 3 }] },
        },
      },
      components: comps,
      hoses: hs,
      notes,
    },
  }
}

/** The demo circuit as first opened, with its two deliberate faults. */
export function demoDocument(): CircuitDocument {
  return document(
    'Camper van, rear turbo four, front radiator',
    components(),
    hoses(),
    'Workshop build sheet. Radiator hoses run under the floor along the left chassis rail.',
  )
}

/** The same build with the third outlet capped and a bleed valve at the top of the heater loop. */
export function correctedDemoDocument(): CircuitDocument {
  const comps = components().map((c) =>
    c.id === 'engine' ? { ...c, ports: c.ports.map((q) => (q.id === 'engine-third' ? { ...q, blocked: true } : q)) } : c,
  )
  comps.push({
    id: 'heater-bleed', type: 'bleed-valve', label: 'Heater bleed valve', position: p(640, 380, 760), rotationDeg: 0, volumeL: 0.02,
    params: {},
    ports: [
      port('heater-bleed-in', 'from heater', 'either', 16, p(0, -20, 0)),
      port('heater-bleed-out', 'to return hose', 'either', 16, p(0, 20, 0)),
      port('heater-bleed-screw', 'bleed screw', 'vent', 6, p(0, 0, 20), true),
    ],
  })
  const hs = hoses().filter((h) => h.id !== 'hose-heater-return')
  hs.push(
    hose('hose-heater-bleed', 'Heater outlet to bleed valve', 'heater-outlet', 'heater-bleed-in', 15.88, 4, 'j20-r3-heater', []),
    hose('hose-heater-return', 'Heater return', 'heater-bleed-out', 'pump-heater-return', 15.88, 4, 'j20-r3-heater', [
      p(640, 420, 600), p(700, 380, FLOOR_Z), p(3350, 0, FLOOR_Z), p(3540, 80, 220),
    ]),
  )
  return document(
    'Camper van, rear turbo four, front radiator (corrected)',
    comps,
    hs,
    'Third outlet capped with a 16 mm blanking cap; bleed valve fitted at the top of the heater loop.',
  )
}
