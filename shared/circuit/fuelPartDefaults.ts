// What a freshly placed fuel part looks like. Figures are typical of the trade (common practice, from
// memory), shown in the editor as "typical; take the part's own". Fuel spigots come as inch sizes and as
// millimetres side by side: 5/16 in (7.94 mm) and 8 mm are interchangeable, 3/8 in (9.53 mm) and 10 mm
// are not (check-values §5), so a new part starts on 5/16 in and the fabricator enters the real size.
import type { ComponentType, PortRole } from './component'
import type { FuelComponentType } from './fuelParts'
import type { PartKind, PortSpec } from './partDefaults'
import type { Point3 } from './primitives'

const pt = (x: number, y: number, z: number): Point3 => ({ x, y, z })
/** as inchMm in partDefaults.ts (which imports this file, so it cannot be imported here at load) */
const inch = (inches: number): number => Math.round(inches * 25.4 * 100 + 1e-9) / 100

/** 5/16 in: the usual carburettor-era feed and an EFI feed or return up to about 250 kW (common practice). */
export const FUEL_SPIGOT_MM = inch(5 / 16) // 7.94 mm
const METRIC_8 = 8
/** 3/8 in: the larger feed; 9.53 mm, not to be mistaken for 10 mm. */
export const FUEL_SPIGOT_LARGE_MM = inch(3 / 8) // 9.53 mm

const spec = (key: string, name: string, role: PortRole, spigotOdMm: number, offset: Point3, blocked = false): PortSpec =>
  ({ key, name, role, spigotOdMm, offset, blocked })

export const FUEL_PART_KINDS: Record<FuelComponentType, PartKind> = {
  'fuel-tank': {
    type: 'fuel-tank', name: 'Fuel tank', group: 'fuel-tank', hint: 'Pickup, return and vent through the top; level sender',
    envelopeMm: pt(800, 600, 250), volumeL: 0,
    ports: [
      spec('pickup', 'pickup (feed out)', 'outlet', FUEL_SPIGOT_MM, pt(-250, -150, 125)),
      spec('return', 'return inlet', 'inlet', FUEL_SPIGOT_MM, pt(-250, 0, 125)),
      // a rollover vent valve sits on the spigot, so a new tank does not report its vent as open
      spec('vent', 'vent (vent valve fitted)', 'vent', METRIC_8, pt(-250, 150, 125), true),
    ],
  },
  'in-tank-pump': {
    type: 'in-tank-pump', name: 'In-tank pump', group: 'fuel-tank', hint: 'Submerged pump on a hanger; strainer sock in the fuel',
    envelopeMm: pt(90, 90, 230), volumeL: 0.05,
    ports: [spec('outlet', 'outlet (hanger top)', 'outlet', FUEL_SPIGOT_MM, pt(0, 0, 115))],
  },
  'inline-pump': {
    type: 'inline-pump', name: 'Inline pump', group: 'fuel-tank', hint: 'External pump below the tank outlet',
    envelopeMm: pt(220, 70, 70), volumeL: 0.05,
    ports: [
      spec('inlet', 'inlet', 'inlet', METRIC_8, pt(-110, 0, 0)),
      spec('outlet', 'outlet', 'outlet', FUEL_SPIGOT_MM, pt(110, 0, 0)),
    ],
  },
  'bulkhead-fitting': {
    type: 'bulkhead-fitting', name: 'Bulkhead fitting', group: 'fuel-tank', hint: 'Through the tank top; opens into the tank',
    envelopeMm: pt(40, 40, 40), volumeL: 0,
    ports: [spec('spigot', 'hose spigot (above the tank)', 'either', FUEL_SPIGOT_MM, pt(0, 0, 20))],
  },
  'fuel-filter': {
    type: 'fuel-filter', name: 'Fuel filter', group: 'fuel-delivery', hint: 'Fine (about 10 µm) after the pump; coarse before it',
    envelopeMm: pt(160, 60, 60), volumeL: 0.1,
    ports: [
      spec('inlet', 'inlet', 'inlet', FUEL_SPIGOT_MM, pt(-80, 0, 0)),
      spec('outlet', 'outlet', 'outlet', FUEL_SPIGOT_MM, pt(80, 0, 0)),
    ],
  },
  'fuel-regulator': {
    type: 'fuel-regulator', name: 'Pressure regulator', group: 'fuel-delivery', hint: 'Holds rail pressure; return-style or returnless',
    envelopeMm: pt(70, 70, 90), volumeL: 0.02,
    ports: [
      spec('inlet', 'fuel inlet', 'inlet', FUEL_SPIGOT_MM, pt(-35, 0, 0)),
      spec('second', 'second port (plug, or feed on to the rail)', 'either', FUEL_SPIGOT_MM, pt(0, -35, 0), true),
      spec('return', 'return to tank', 'outlet', FUEL_SPIGOT_MM, pt(35, 0, 0)),
    ],
  },
  'fuel-rail': {
    type: 'fuel-rail', name: 'Fuel rail', group: 'fuel-delivery', hint: 'Feeds the injectors; inlet and outlet ends',
    envelopeMm: pt(400, 40, 40), volumeL: 0.05,
    ports: [
      spec('inlet', 'inlet', 'inlet', FUEL_SPIGOT_MM, pt(-200, 0, 0)),
      spec('outlet', 'outlet (to the regulator)', 'outlet', FUEL_SPIGOT_MM, pt(200, 0, 0)),
    ],
  },
  injector: {
    type: 'injector', name: 'Injectors', group: 'fuel-delivery', hint: 'The set in the rail: how many, rated flow and pressure',
    envelopeMm: pt(30, 30, 80), volumeL: 0,
    // an injector sits in the rail's cup on an O-ring: no hose goes on it, so its seat comes closed
    ports: [spec('seat', 'rail seat (O-ring, no hose)', 'inlet', FUEL_SPIGOT_MM, pt(0, 0, 40), true)],
  },
}

/** The shared fittings take fuel sizes when placed in a fuel circuit: a 3/8 in to 5/16 in adapter, 5/16 in tees. */
export const FUEL_FITTING_PORTS: Partial<Record<ComponentType, PortSpec[]>> = {
  tee: [
    spec('run-a', 'run A', 'either', FUEL_SPIGOT_MM, pt(-40, 0, 0)),
    spec('run-b', 'run B', 'either', FUEL_SPIGOT_MM, pt(40, 0, 0)),
    spec('branch', 'branch', 'either', FUEL_SPIGOT_MM, pt(0, 0, 30)),
  ],
  reducer: [
    spec('large', 'large end', 'either', FUEL_SPIGOT_LARGE_MM, pt(-30, 0, 0)),
    spec('small', 'small end', 'either', FUEL_SPIGOT_MM, pt(30, 0, 0)),
  ],
  'blanking-plug': [spec('spigot', 'spigot', 'either', FUEL_SPIGOT_MM, pt(-15, 0, 0))],
  generic: [
    spec('port-1', 'port 1', 'either', FUEL_SPIGOT_MM, pt(-50, 0, 0)),
    spec('port-2', 'port 2', 'either', FUEL_SPIGOT_MM, pt(50, 0, 0)),
  ],
}

/** The shared fittings a fuel circuit's palette offers beside the fuel parts. */
export const FUEL_SHARED_FITTINGS = ['tee', 'reducer', 'blanking-plug', 'generic'] as const satisfies readonly ComponentType[]

/**
 * Params of a new fuel part (common practice, from memory): a pump of the usual 255 L/h class at
 * 13.5 V, about 250 L/h at 3 bar falling to about 195 L/h at 5 bar; a 10 µm filter (the usual EFI
 * post-pump rating) and a 100 µm strainer sock; a return-style regulator at 3 bar (43.5 psi),
 * referenced to the manifold so fuel pressure follows boost 1:1; four injectors of 250 cc/min rated
 * at 3 bar; a 50 L tank with its sender.
 */
export function fuelDefaultParams(type: FuelComponentType): Record<string, unknown> {
  const curve = () => [{ pressureKpa: 300, flowLph: 250 }, { pressureKpa: 400, flowLph: 225 }, { pressureKpa: 500, flowLph: 195 }]
  switch (type) {
    case 'fuel-tank': return { capacityL: 50, senderFitted: true }
    case 'in-tank-pump': return { curve: curve(), strainerMicron: 100 }
    case 'inline-pump': return { curve: curve() }
    case 'fuel-filter': return { micron: 10 }
    case 'fuel-regulator': return { basePressureKpa: 300, reference: 'manifold', style: 'return' }
    case 'injector': return { count: 4, ratedFlowCcMin: 250, ratedPressureKpa: 300 }
    default: return {}
  }
}
