import { z } from 'zod'
import { bounded } from './primitives'

/** The fuels a conversion is built for; their densities and ethanol shares are in shared/physics/fuel.ts. */
export const fuelKinds = ['petrol', 'e5', 'e10', 'e85'] as const
export type FuelKind = (typeof fuelKinds)[number]

/**
 * Everything that only a fuel circuit has: what the engine asks of the fuel system at full power.
 * Power and fuel consumption in SI (kW, g/kWh); the editor shows hp and lb/(hp·h) beside them.
 */
export const fuelSettings = z.strictObject({
  fuel: z.enum(fuelKinds),
  /** density of the fuel actually used, kg/L at 15 °C; absent: the physics layer's figure for the fuel */
  densityKgL: bounded(0.6, 1, 'kg/L').optional(),
  /** the power the system is sized for, at the crank */
  targetPowerKw: bounded(1, 2000, 'kW'),
  /** brake-specific fuel consumption at that power */
  bsfcGPerKwh: bounded(150, 1000, 'g/kWh'),
  /** highest share of each engine cycle an injector may be open */
  maxInjectorDutyPercent: bounded(10, 100, '%'),
  /** highest boost in the intake manifold, gauge; 0 for an engine without a turbo or supercharger */
  maxBoostKpa: bounded(0, 500, 'kPa'),
})
export type FuelSettings = z.infer<typeof fuelSettings>
