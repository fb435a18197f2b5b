// What a freshly placed part looks like: its ports, spigot sizes, coolant volume and typical size.
// Every figure here is typical of the trade (common practice, from memory) and is shown in the editor
// as "typical; take the part's own figures": the fabricator measures the real spigots and reads the
// maker's data. Spigots come in millimetres and in inch fractions (25.4 mm/in exactly, see
// shared/physics/units.ts), so both appear: a 5/8 in heater spigot is 15.88 mm, a 1-1/4 in one 31.75 mm.
import { MM_PER_INCH } from '../physics/units'
import { coolantComponentTypes, type Component, type ComponentType, type Port, type PortRole } from './component'
import type { CircuitKindName } from './document'
import { FUEL_FITTING_PORTS, FUEL_PART_KINDS, FUEL_SHARED_FITTINGS, fuelDefaultParams } from './fuelPartDefaults'
import { fuelComponentTypes, type FuelComponentType } from './fuelParts'
import { childId } from './ids'
import type { Point3 } from './primitives'

export const TYPICAL_FIGURES_NOTE = 'Typical figures; take the part’s own.'

/** An inch size in mm, to the 0.01 mm the drawing keeps (5/8 in → 15.88 mm). */
// × 2540 in one step: 0.375 × 2540 is exactly 952.5 and rounds up to 9.53 mm, where × 25.4 × 100 lands a hair under it
export const inchMm = (inches: number): number => Math.round(inches * MM_PER_INCH * 100 + 1e-9) / 100

/** Palette groups in the order they are shown; the fittings serve both kinds of circuit. */
export const partGroups = [
  { id: 'engine', name: 'Engine and pump' },
  { id: 'exchangers', name: 'Radiators and heaters' },
  { id: 'control', name: 'Thermostats and valves' },
  { id: 'filling', name: 'Filling, venting, expansion' },
  { id: 'fuel-tank', name: 'Tank and pumps' },
  { id: 'fuel-delivery', name: 'Filters, rail and regulator' },
  { id: 'fittings', name: 'Fittings' },
] as const
export type PartGroupId = (typeof partGroups)[number]['id']

export interface PortSpec {
  key: string
  name: string
  role: PortRole
  spigotOdMm: number
  offset: Point3
  blocked: boolean
}

export interface PartKind {
  type: ComponentType
  /** the word the workshop uses */
  name: string
  group: PartGroupId
  hint: string
  /** typical outside size along the part's own x, y, z, mm; the drawing uses it for the symbol */
  envelopeMm: Point3
  volumeL: number
  ports: PortSpec[]
}

const pt = (x: number, y: number, z: number): Point3 => ({ x, y, z })
// Vent, fill and drain spigots come capped (a closed bleed screw, the filler cap, a drain plug), so a
// new part does not report them as open before the fabricator decides what goes there.
const port = (key: string, name: string, role: PortRole, spigotOdMm: number, offset: Point3): PortSpec => ({
  key, name, role, spigotOdMm, offset, blocked: role === 'vent' || role === 'fill' || role === 'drain',
})

const HEATER = inchMm(5 / 8) // 15.88 mm
const RADIATOR = 32
const RADIATOR_INCH = inchMm(1.25) // 31.75 mm
const BYPASS = inchMm(3 / 4) // 19.05 mm
const BLEED = 8
const DRAIN = 10

export const PART_KINDS: Record<ComponentType, PartKind> = {
  engine: {
    type: 'engine', name: 'Engine', group: 'engine', hint: 'Block and head water jacket',
    envelopeMm: pt(600, 600, 650), volumeL: 3.5,
    ports: [
      port('head-outlet', 'head outlet', 'outlet', RADIATOR, pt(-300, -120, 230)),
      port('block-inlet', 'block inlet', 'inlet', RADIATOR_INCH, pt(-300, 150, -160)),
      port('heater-outlet', 'heater outlet', 'outlet', HEATER, pt(300, -150, 200)),
    ],
  },
  'water-pump': {
    type: 'water-pump', name: 'Water pump', group: 'engine', hint: 'Belt or electric coolant pump',
    envelopeMm: pt(160, 160, 160), volumeL: 0.3,
    ports: [
      port('suction', 'suction inlet', 'inlet', RADIATOR_INCH, pt(-80, 0, 0)),
      port('outlet', 'pump outlet', 'outlet', RADIATOR, pt(80, 0, 0)),
      port('return', 'heater and bypass return', 'inlet', HEATER, pt(0, 80, 40)),
    ],
  },
  radiator: {
    type: 'radiator', name: 'Radiator', group: 'exchangers', hint: 'Crossflow, tanks left and right',
    envelopeMm: pt(60, 650, 450), volumeL: 2.5,
    ports: [
      port('top-inlet', 'top tank inlet', 'inlet', RADIATOR, pt(30, 325, 180)),
      port('bottom-outlet', 'bottom tank outlet', 'outlet', RADIATOR, pt(30, -325, -180)),
      port('drain', 'drain tap', 'drain', DRAIN, pt(30, -325, -225)),
      port('bleed', 'bleed screw', 'vent', BLEED, pt(30, -325, 225)),
    ],
  },
  'heater-core': {
    type: 'heater-core', name: 'Heater core', group: 'exchangers', hint: 'Cab heater matrix',
    envelopeMm: pt(60, 200, 160), volumeL: 0.4,
    ports: [
      port('inlet', 'inlet', 'inlet', HEATER, pt(-30, -50, 60)),
      port('outlet', 'outlet', 'outlet', HEATER, pt(-30, 50, 60)),
    ],
  },
  thermostat: {
    type: 'thermostat', name: 'Thermostat', group: 'control', hint: 'Inline housing with a wax element',
    envelopeMm: pt(90, 90, 90), volumeL: 0.2,
    ports: [
      port('engine-side', 'engine side', 'inlet', RADIATOR, pt(-45, 0, 0)),
      port('radiator-side', 'radiator side', 'outlet', RADIATOR, pt(45, 0, 0)),
      port('bypass', 'bypass outlet', 'outlet', BYPASS, pt(0, 45, -20)),
    ],
  },
  'thermostat-housing': {
    type: 'thermostat-housing', name: 'Thermostat housing', group: 'control', hint: 'Outlet elbow or housing, no valve',
    envelopeMm: pt(100, 80, 80), volumeL: 0.15,
    ports: [
      port('inlet', 'inlet', 'either', RADIATOR, pt(-50, 0, 0)),
      port('outlet', 'outlet', 'either', RADIATOR, pt(50, 0, 0)),
    ],
  },
  'heater-valve': {
    type: 'heater-valve', name: 'Heater valve', group: 'control', hint: 'Tap that shuts the heater off',
    envelopeMm: pt(70, 40, 60), volumeL: 0.02,
    ports: [
      port('inlet', 'inlet', 'inlet', HEATER, pt(-35, 0, 0)),
      port('outlet', 'outlet', 'outlet', HEATER, pt(35, 0, 0)),
    ],
  },
  'pressure-cap': {
    type: 'pressure-cap', name: 'Filler neck with cap', group: 'filling', hint: 'Pressure cap on an inline neck',
    envelopeMm: pt(90, 60, 100), volumeL: 0.05,
    ports: [
      port('cap', 'filler and pressure cap', 'fill', 40, pt(0, 0, 50)),
      port('run-a', 'hose spigot A', 'either', RADIATOR, pt(-45, 0, -20)),
      port('run-b', 'hose spigot B', 'either', RADIATOR, pt(45, 0, -20)),
    ],
  },
  'expansion-tank': {
    type: 'expansion-tank', name: 'Expansion tank', group: 'filling', hint: 'Pressurised tank with its cap',
    envelopeMm: pt(200, 150, 200), volumeL: 1,
    ports: [
      port('cap', 'filler and pressure cap', 'fill', 40, pt(0, 0, 100)),
      port('outlet', 'bottom outlet (static line)', 'outlet', HEATER, pt(0, 0, -100)),
      port('vent-inlet', 'vent inlet', 'inlet', BLEED, pt(100, 0, 70)),
    ],
  },
  'overflow-bottle': {
    type: 'overflow-bottle', name: 'Overflow bottle', group: 'filling', hint: 'Unpressurised catch bottle',
    envelopeMm: pt(120, 80, 180), volumeL: 0.3,
    ports: [port('inlet', 'overflow inlet', 'inlet', BLEED, pt(0, 0, 90))],
  },
  'deaeration-pot': {
    type: 'deaeration-pot', name: 'De-aeration pot', group: 'filling', hint: 'Swirl pot that parts air from coolant',
    envelopeMm: pt(150, 150, 220), volumeL: 0.8,
    ports: [
      port('inlet', 'tangential inlet', 'inlet', RADIATOR, pt(-75, 0, 50)),
      port('outlet', 'bottom outlet', 'outlet', RADIATOR, pt(0, 0, -110)),
      port('vent', 'vent to tank', 'vent', BLEED, pt(0, 0, 110)),
    ],
  },
  'bleed-valve': {
    type: 'bleed-valve', name: 'Bleed tee', group: 'filling', hint: 'Inline tee with a bleed screw on top',
    envelopeMm: pt(60, 40, 60), volumeL: 0.02,
    ports: [
      port('run-a', 'run A', 'either', HEATER, pt(-30, 0, 0)),
      port('run-b', 'run B', 'either', HEATER, pt(30, 0, 0)),
      port('bleed', 'bleed screw', 'vent', BLEED, pt(0, 0, 30)),
    ],
  },
  tee: {
    type: 'tee', name: 'Tee', group: 'fittings', hint: 'Run and branch, e.g. a heater take-off',
    envelopeMm: pt(80, 40, 40), volumeL: 0.03,
    ports: [
      port('run-a', 'run A', 'either', RADIATOR, pt(-40, 0, 0)),
      port('run-b', 'run B', 'either', RADIATOR, pt(40, 0, 0)),
      port('branch', 'branch', 'either', HEATER, pt(0, 0, 30)),
    ],
  },
  reducer: {
    type: 'reducer', name: 'Reducer', group: 'fittings', hint: 'Joins two hose sizes',
    envelopeMm: pt(60, 40, 40), volumeL: 0.02,
    ports: [
      port('large', 'large end', 'either', inchMm(1.5), pt(-30, 0, 0)),
      port('small', 'small end', 'either', RADIATOR, pt(30, 0, 0)),
    ],
  },
  'blanking-plug': {
    type: 'blanking-plug', name: 'Hose plug', group: 'fittings', hint: 'Closes the end of a hose',
    envelopeMm: pt(30, 20, 20), volumeL: 0,
    ports: [port('spigot', 'spigot', 'either', HEATER, pt(-15, 0, 0))],
  },
  drain: {
    type: 'drain', name: 'Drain tap', group: 'fittings', hint: 'Inline tee with a drain tap underneath',
    envelopeMm: pt(60, 40, 60), volumeL: 0.02,
    ports: [
      port('run-a', 'run A', 'either', HEATER, pt(-30, 0, 0)),
      port('run-b', 'run B', 'either', HEATER, pt(30, 0, 0)),
      port('tap', 'drain tap', 'drain', DRAIN, pt(0, 0, -30)),
    ],
  },
  generic: {
    type: 'generic', name: 'Other part', group: 'fittings', hint: 'Anything else with two spigots',
    envelopeMm: pt(100, 100, 100), volumeL: 0.1,
    ports: [
      port('port-1', 'port 1', 'either', HEATER, pt(-50, 0, 0)),
      port('port-2', 'port 2', 'either', HEATER, pt(50, 0, 0)),
    ],
  },
  ...FUEL_PART_KINDS,
}

/** The part types each kind of circuit's palette offers: its own parts and the fittings both use. */
export const PART_TYPES_BY_KIND: Record<CircuitKindName, readonly ComponentType[]> = {
  coolant: coolantComponentTypes,
  fuel: [...fuelComponentTypes, ...FUEL_SHARED_FITTINGS],
}

/** The palette of a kind of circuit: its groups in order, each with its part types; empty groups left out. */
export function paletteGroupsFor(kind: CircuitKindName): Array<{ id: PartGroupId; name: string; types: ComponentType[] }> {
  const types = PART_TYPES_BY_KIND[kind]
  return partGroups
    .map((g) => ({ id: g.id, name: g.name, types: types.filter((t) => PART_KINDS[t].group === g.id) }))
    .filter((g) => g.types.length > 0)
}

/** A part type's typical ports in a kind of circuit: the shared fittings take fuel sizes in a fuel circuit. */
export function portSpecsFor(type: ComponentType, kind: CircuitKindName = 'coolant'): PortSpec[] {
  return (kind === 'fuel' ? FUEL_FITTING_PORTS[type] : undefined) ?? PART_KINDS[type].ports
}

/** Type-specific params of a new part: a thermostat rated 88 °C fully open at 100 °C (a common OE rating), a 100 kPa cap. */
function defaultParams(type: ComponentType, portIds: Map<string, string>): Component['params'] {
  switch (type) {
    case 'thermostat':
      return { openingTempC: 88, fullOpenTempC: 100, valvedPortId: portIds.get('radiator-side')! }
    case 'pressure-cap':
      return { ratingKpa: 100 }
    case 'expansion-tank':
      return { capRatingKpa: 100, capacityL: 2 }
    case 'water-pump':
      return { drive: 'belt' }
    case 'heater-valve':
      return { open: true }
    default:
      return (fuelComponentTypes as readonly string[]).includes(type) ? fuelDefaultParams(type as FuelComponentType) as Component['params'] : {}
  }
}

/**
 * A new part of a type at a position, with fresh ids for it and its ports (`existing` is updated).
 * `circuitKind` picks the shared fittings' sizes (fuel sizes in a fuel circuit).
 */
export function defaultComponent(
  type: ComponentType, id: string, position: Point3, existing: Set<string>, circuitKind: CircuitKindName = 'coolant',
): Component {
  const kind = PART_KINDS[type]
  const portIds = new Map<string, string>()
  const ports: Port[] = portSpecsFor(type, circuitKind).map((spec) => {
    const portId = childId(id, spec.key, existing)
    portIds.set(spec.key, portId)
    return { id: portId, name: spec.name, role: spec.role, spigotOdMm: spec.spigotOdMm, offset: { ...spec.offset }, blocked: spec.blocked }
  })
  return {
    id, type, label: kind.name, position: { ...position }, rotationDeg: 0, volumeL: kind.volumeL,
    params: defaultParams(type, portIds), ports,
  } as Component
}
