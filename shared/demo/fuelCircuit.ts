// The demo build's fuel side: the camper van's original carburettor-era tank under the floor, converted
// to feed the rear turbo four's injection. A pump hanger with an in-tank pump goes into the sender
// flange (the level sender moves onto the hanger); the old carburettor pickup is capped; a new bulkhead
// fitting through the tank top takes the return. A fine filter sits on the right chassis rail, and a
// return-style regulator at the end of the rail is referenced to the manifold, so fuel pressure follows
// boost 1:1. Invented for the demo.
//
// One thing is left undone on purpose, so the checks have something to show on first start: the return
// line from the regulator to the tank is not drawn yet (no-return-line). `correctedFuelDemoDocument()`
// is the same build with the return line run.
import type { CircuitDocument, Component, Hose, Point3, Port } from '../circuit'

const p = (x: number, y: number, z: number): Point3 => ({ x, y, z })
const FIVE_SIXTEENTHS = 7.94 // 5/16 in at 25.4 mm/in, to the drawing's 0.01 mm

function port(id: string, name: string, role: Port['role'], offset: Point3, blocked = false, spigotOdMm = FIVE_SIXTEENTHS): Port {
  return { id, name, role, spigotOdMm, offset, blocked }
}

function hose(id: string, label: string, from: string, to: string, route: Point3[], material: Hose['material'] = 'j30-r9'): Hose {
  return {
    id, from: { portId: from, clamp: 'efi-band' }, to: { portId: to, clamp: 'efi-band' },
    insideDiameterMm: FIVE_SIXTEENTHS, wallMm: 3.5, material, params: { label, route },
  }
}

function components(): Component[] {
  return [
    {
      id: 'tank', type: 'fuel-tank', label: 'Fuel tank (original, under the floor)', position: p(2300, -300, -250), rotationDeg: 0, volumeL: 0,
      params: { capacityL: 55, senderFitted: true },
      ports: [
        port('tank-pickup', 'old carburettor pickup (capped)', 'outlet', p(-300, -150, 125), true),
        port('tank-vent', 'vent (rollover valve fitted)', 'vent', p(300, 150, 125), true, 8),
      ],
    },
    {
      id: 'pump', type: 'in-tank-pump', label: 'In-tank pump (hanger in the sender flange)', position: p(2400, -300, -250), rotationDeg: 0, volumeL: 0.05,
      params: { curve: [{ pressureKpa: 280, flowLph: 255 }, { pressureKpa: 400, flowLph: 225 }, { pressureKpa: 550, flowLph: 185 }], strainerMicron: 100 },
      ports: [port('pump-out', 'outlet (hanger top)', 'outlet', p(0, 0, 125))],
    },
    {
      id: 'return-bulkhead', type: 'bulkhead-fitting', label: 'Return bulkhead (new, tank top)', position: p(2150, -420, -115), rotationDeg: 0, volumeL: 0,
      params: {},
      ports: [port('return-bulkhead-spigot', 'hose spigot (above the tank)', 'either', p(0, 0, 20))],
    },
    {
      id: 'filter', type: 'fuel-filter', label: 'Fine filter (right chassis rail)', position: p(2900, -420, -60), rotationDeg: 0, volumeL: 0.1,
      params: { micron: 10 },
      ports: [port('filter-in', 'inlet', 'inlet', p(-80, 0, 0)), port('filter-out', 'outlet', 'outlet', p(80, 0, 0))],
    },
    {
      id: 'rail', type: 'fuel-rail', label: 'Fuel rail', position: p(3900, 150, 750), rotationDeg: 0, volumeL: 0.05,
      params: {},
      ports: [port('rail-in', 'inlet', 'inlet', p(-200, 0, 0)), port('rail-out', 'outlet (to the regulator)', 'outlet', p(200, 0, 0))],
    },
    {
      id: 'injectors', type: 'injector', label: 'Injectors (four, in the rail)', position: p(3900, 150, 690), rotationDeg: 0, volumeL: 0,
      params: { count: 4, ratedFlowCcMin: 550, ratedPressureKpa: 300 },
      ports: [port('injectors-seat', 'rail seats (O-rings, no hose)', 'inlet', p(0, 0, 40), true)],
    },
    {
      id: 'regulator', type: 'fuel-regulator', label: 'Regulator (rail end)', position: p(4200, 150, 750), rotationDeg: 0, volumeL: 0.02,
      params: { basePressureKpa: 300, reference: 'manifold', style: 'return' },
      ports: [
        port('regulator-in', 'fuel inlet', 'inlet', p(-35, 0, 0)),
        port('regulator-second', 'second port (plugged)', 'either', p(0, -35, 0), true),
        port('regulator-return', 'return to tank', 'outlet', p(35, 0, 0)),
      ],
    },
  ]
}

function hoses(): Hose[] {
  return [
    hose('hose-pump-filter', 'Pump to filter', 'pump-out', 'filter-in', [p(2400, -300, -90), p(2500, -420, -70)]),
    hose('hose-feed', 'Feed along the right rail', 'filter-out', 'rail-in', [p(3500, -420, -60), p(3650, -300, 200), p(3650, 150, 700)]),
    hose('hose-rail-regulator', 'Rail to regulator', 'rail-out', 'regulator-in', []),
  ]
}

/** The return line the first-start drawing still lacks: regulator to the new bulkhead, back along the right rail. */
function returnHose(): Hose {
  return hose('hose-return', 'Return along the right rail', 'regulator-return', 'return-bulkhead-spigot', [
    p(4300, 150, 400), p(3650, -500, 200), p(3500, -500, -60), p(2200, -500, -60),
  ])
}

function document(title: string, comps: Component[], hs: Hose[], notes: string): CircuitDocument {
  return {
    format: 'hosewright.circuit',
    formatVersion: 1,
    circuit: {
      kind: 'fuel',
      title,
      settings: {
        allowance: { percent: 5, perEndMm: 25 },
        datum: 'Top face of the chassis rail, level ground',
        // a turbo four of about 180 kW; BSFC 0.60 lb/(hp·h) for a turbo engine (common practice), 1 bar of boost
        fuel: { fuel: 'e10', targetPowerKw: 180, bsfcGPerKwh: 365, maxInjectorDutyPercent: 80, maxBoostKpa: 100 },
      },
      components: comps,
      hoses: hs,
      notes,
    },
  }
}

/** The fuel conversion as first opened: the return line is not run yet. */
export function fuelDemoDocument(): CircuitDocument {
  return document(
    'Camper van fuel: carburettor tank to injection',
    components(),
    hoses(),
    'Conversion sheet. Original tank kept; pump hanger in the sender flange; return bulkhead fitted, return line still to run.',
  )
}

/** The same conversion with the return line run from the regulator to the bulkhead. */
export function correctedFuelDemoDocument(): CircuitDocument {
  return document(
    'Camper van fuel: carburettor tank to injection (corrected)',
    components(),
    [...hoses(), returnHose()],
    'Return line run from the regulator to the tank-top bulkhead along the right chassis rail.',
  )
}
