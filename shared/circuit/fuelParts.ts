// The parts of a fuel circuit: a carburettor-era tank and lines converted to injection. Each type has
// its own params; the model, the drawing and the checks treat them like the coolant parts.
//
// Units in the keys: the trade states pump flow in L/h against pressure in kPa (or bar, psi) and an
// injector's flow in cc/min (or lb/h) at a rated pressure, so the model keeps those figures as the data
// sheet gives them (…Lph, …CcMin); the engine turns them into L/min where it meets the physics layer.
import { z } from 'zod'
import { bounded } from './primitives'
import { withResistance } from './resistance'

export const fuelComponentTypes = [
  'fuel-tank', 'in-tank-pump', 'inline-pump', 'fuel-filter', 'fuel-regulator', 'fuel-rail', 'injector', 'bulkhead-fitting',
] as const
export type FuelComponentType = (typeof fuelComponentTypes)[number]

/** One point of a fuel pump's curve: the flow it delivers against an outlet pressure (gauge). */
export const fuelPumpPoint = z.strictObject({
  pressureKpa: bounded(0, 1500, 'kPa'),
  flowLph: bounded(0, 5000, 'L/h'),
})
export type FuelPumpPoint = z.infer<typeof fuelPumpPoint>

/** Two or three points off the maker's curve at the system voltage; pressures rise, flows do not. */
export const fuelPumpCurve = z
  .array(fuelPumpPoint)
  .min(2, 'A fuel pump curve has two or three points')
  .max(3, 'A fuel pump curve has two or three points')

/** How the regulator is referenced: to the intake manifold (fuel pressure follows boost 1:1) or to the air. */
export const regulatorReferences = ['manifold', 'none'] as const
export type RegulatorReference = (typeof regulatorReferences)[number]
/** Return-style: the surplus goes back to the tank by a return line; returnless: the rail is a dead end. */
export const regulatorStyles = ['return', 'returnless'] as const
export type RegulatorStyle = (typeof regulatorStyles)[number]

const micron = bounded(1, 1000, 'µm')

export const fuelComponentParams = {
  'fuel-tank': z.strictObject({
    ...withResistance,
    /** brim-full capacity */
    capacityL: bounded(1, 1000, 'L'),
    /** the level sender stays in its flange (or goes into the pump hanger) */
    senderFitted: z.boolean().optional(),
  }),
  'in-tank-pump': z.strictObject({
    ...withResistance,
    curve: fuelPumpCurve,
    /** the strainer sock on its inlet; absent: the engine takes the usual coarse sock */
    strainerMicron: micron.optional(),
  }),
  'inline-pump': z.strictObject({ ...withResistance, curve: fuelPumpCurve }),
  'fuel-filter': z.strictObject({ ...withResistance, micron }),
  'fuel-regulator': z.strictObject({
    ...withResistance,
    /** pressure it holds with the engine off (manifold at the air), gauge */
    basePressureKpa: bounded(20, 1000, 'kPa'),
    reference: z.enum(regulatorReferences),
    style: z.enum(regulatorStyles),
  }),
  'fuel-rail': z.strictObject({ ...withResistance }),
  injector: z.strictObject({
    ...withResistance,
    /** injectors of this kind in the rail(s) */
    count: z.number({ message: 'Must be a whole number of injectors' }).int('Must be a whole number of injectors')
      .min(1, 'Must be at least 1 injector').max(32, 'Must be at most 32 injectors'),
    /** the maker's flow at the rated pressure, cc/min (1 cc = 1 mL) */
    ratedFlowCcMin: bounded(10, 5000, 'cc/min'),
    /** pressure across the injector at which it was rated */
    ratedPressureKpa: bounded(50, 1000, 'kPa'),
  }),
  'bulkhead-fitting': z.strictObject({ ...withResistance }),
} satisfies Record<FuelComponentType, z.ZodType>
