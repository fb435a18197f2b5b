import { z } from 'zod'
import { fuelComponentParams, fuelComponentTypes } from './fuelParts'
import { bounded, elementId, labelText, point3 } from './primitives'
import { withResistance } from './resistance'

export { resistance, type Resistance } from './resistance'

export const portRoles = ['inlet', 'outlet', 'either', 'fill', 'vent', 'drain'] as const
export type PortRole = (typeof portRoles)[number]

/** A connection on a part: a spigot a hose pushes over. `offset` is from the part's position, in the part's axes. */
export const port = z.strictObject({
  id: elementId,
  name: labelText('Port name', 80),
  role: z.enum(portRoles),
  spigotOdMm: bounded(1, 200, 'mm'),
  offset: point3,
  /** a plug or cap is fitted, so nothing flows through this port */
  blocked: z.boolean(),
})
export type Port = z.infer<typeof port>

export const coolantComponentTypes = [
  'engine', 'water-pump', 'radiator', 'thermostat', 'thermostat-housing', 'pressure-cap', 'expansion-tank',
  'overflow-bottle', 'heater-core', 'heater-valve', 'bleed-valve', 'tee', 'reducer', 'blanking-plug', 'drain',
  'deaeration-pot', 'generic',
] as const
/** Every part type; coolant parts first, then the fuel parts (shared/circuit/fuelParts.ts). Each has its own params schema below. */
export const componentTypes = [...coolantComponentTypes, ...fuelComponentTypes] as const
export type ComponentType = (typeof componentTypes)[number]

/** Per-type parameters. Adding a type means adding one entry here. */
export const componentParams = {
  engine: z.strictObject({ ...withResistance }),
  'water-pump': z.strictObject({ ...withResistance, drive: z.enum(['belt', 'electric']).optional() }),
  radiator: z.strictObject({ ...withResistance }),
  thermostat: z.strictObject({
    ...withResistance,
    /** stamped rating: start-to-open */
    openingTempC: bounded(40, 130, '°C'),
    fullOpenTempC: bounded(40, 140, '°C'),
    /** the port the valve shuts when cold (the radiator side) */
    valvedPortId: elementId,
    /** a jiggle valve or bleed hole lets a little coolant past the shut valve */
    hasBypass: z.boolean().optional(),
  }),
  'thermostat-housing': z.strictObject({ ...withResistance }),
  'pressure-cap': z.strictObject({ ...withResistance, ratingKpa: bounded(0, 300, 'kPa') }),
  'expansion-tank': z.strictObject({
    ...withResistance,
    /** rating of a pressure cap fitted on the tank itself; absent for an unpressurised tank */
    capRatingKpa: bounded(0, 300, 'kPa').optional(),
    /** brim-full capacity; `volumeL` is the coolant in it at the cold mark */
    capacityL: bounded(0, 100, 'L').optional(),
  }),
  'overflow-bottle': z.strictObject({ ...withResistance }),
  'heater-core': z.strictObject({ ...withResistance }),
  'heater-valve': z.strictObject({ ...withResistance, open: z.boolean().optional() }),
  'bleed-valve': z.strictObject({ ...withResistance }),
  tee: z.strictObject({ ...withResistance }),
  reducer: z.strictObject({ ...withResistance }),
  'blanking-plug': z.strictObject({ ...withResistance }),
  drain: z.strictObject({ ...withResistance }),
  'deaeration-pot': z.strictObject({ ...withResistance }),
  generic: z.strictObject({ ...withResistance }),
  ...fuelComponentParams,
} satisfies Record<ComponentType, z.ZodType>

const componentHead = {
  label: labelText('Label', 120),
  position: point3,
  /** rotation about the vertical z axis; turns port offsets in x/y */
  rotationDeg: bounded(-360, 360, '°'),
  /** liquid the part holds: coolant, or fuel in the lines and parts of a fuel circuit (a tank's own contents are not counted) */
  volumeL: bounded(0, 1000, 'L'),
}
const ports = z.array(port).max(64, 'A part has at most 64 ports')

/** Keys in the order the document is written: id, type, the flat columns, params, ports. */
function componentOf<T extends ComponentType>(type: T) {
  return z.strictObject({ id: elementId, type: z.literal(type), ...componentHead, params: componentParams[type], ports })
}

const variants = componentTypes.map((t) => componentOf(t)) as unknown as [
  ReturnType<typeof componentOf<ComponentType>>,
  ...ReturnType<typeof componentOf<ComponentType>>[],
]

export const component = z.discriminatedUnion('type', variants)
type ComponentOf<T extends ComponentType> = {
  type: T
  id: string
  label: string
  position: z.infer<typeof point3>
  rotationDeg: number
  volumeL: number
  ports: Port[]
  params: z.infer<(typeof componentParams)[T]>
}
/** A part, with its params typed by its `type`. */
export type Component = { [T in ComponentType]: ComponentOf<T> }[ComponentType]
export type ComponentParams<T extends ComponentType> = z.infer<(typeof componentParams)[T]>
