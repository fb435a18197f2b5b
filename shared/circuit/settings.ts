import { z } from 'zod'
import { fuelSettings } from './fuelSettings'
import { bounded, labelText } from './primitives'

export * from './fuelSettings'

export const coolantFluids = ['water', 'ethylene-glycol', 'propylene-glycol'] as const
export const coolantMix = z.strictObject({
  fluid: z.enum(coolantFluids),
  /** glycol concentrate as percent of the mixed volume; ignored for plain water */
  percentByVolume: bounded(0, 100, '%'),
})
export type CoolantMixSetting = z.infer<typeof coolantMix>

const pumpPoint = z.strictObject({ flowLpm: bounded(0, 2000, 'L/min'), headM: bounded(0, 200, 'm') })

/** The coolant pump as the engine's data gives it: a fixed flow at an engine speed, or a three-point head curve. */
export const pumpSetting = z.discriminatedUnion('mode', [
  z.strictObject({ mode: z.literal('fixed'), flowLpm: bounded(0.1, 2000, 'L/min'), atRpm: bounded(0, 20000, 'rpm') }),
  z.strictObject({
    mode: z.literal('curve'),
    atRpm: bounded(0, 20000, 'rpm'),
    points: z.array(pumpPoint).length(3, 'A pump curve has exactly 3 points'),
  }),
])
export type PumpSetting = z.infer<typeof pumpSetting>

/** Everything that only a coolant circuit has. A fuel circuit has a `fuel` block instead (fuelSettings). */
export const coolantSettings = z.strictObject({
  mix: coolantMix,
  /** pressure-cap rating, gauge */
  capRatingKpa: bounded(0, 300, 'kPa'),
  /** hottest coolant the engine maker allows at the engine outlet */
  maxCoolantTempC: bounded(40, 150, '°C'),
  /** coldest air the vehicle will stand in */
  minAmbientC: bounded(-70, 40, '°C'),
  /** temperature for fluid properties in the flow solve; default: the thermostat's full-open temperature */
  operatingTempC: bounded(0, 150, '°C').optional(),
  pump: pumpSetting,
})
export type CoolantSettings = z.infer<typeof coolantSettings>

export const allowanceSetting = z.strictObject({
  /** extra length on the drawn or measured length, for routing slack */
  percent: bounded(0, 50, '%'),
  /** extra per hose end, for the length pushed over the spigot */
  perEndMm: bounded(0, 200, 'mm'),
})

/**
 * Check thresholds. Every one is optional; the engine fills the documented defaults
 * (DEFAULT_THRESHOLDS in shared/engine/thresholds.ts, listed in docs/engine.md).
 */
export const thresholdSettings = z.strictObject({
  boilMarginK: bounded(0, 60, 'K').optional(),
  maxVelocityMS: bounded(0.1, 20, 'm/s').optional(),
  minBranchFlowLpm: bounded(0, 200, 'L/min').optional(),
  airTrapToleranceMm: bounded(0, 500, 'mm').optional(),
  fitLooseMm: bounded(0, 5, 'mm').optional(),
  fitStretchPercent: bounded(0, 30, '%').optional(),
  /** fuel: pump flow needed above the engine's demand */
  fuelPumpMarginPercent: bounded(0, 200, '%').optional(),
  /** fuel: highest velocity in the line from the tank to an inline pump's inlet */
  fuelSuctionVelocityMS: bounded(0.1, 20, 'm/s').optional(),
  /** fuel: highest velocity in the pressure line from the pump to the rail and regulator */
  fuelSupplyVelocityMS: bounded(0.1, 20, 'm/s').optional(),
  /** fuel: highest velocity in the return line from the regulator to the tank */
  fuelReturnVelocityMS: bounded(0.1, 20, 'm/s').optional(),
  /** fuel: a filter this fine or finer after the pump protects the injectors */
  fineFilterMicron: bounded(1, 1000, 'µm').optional(),
  /** fuel: a filter finer than this before a pump's inlet restricts it (only a coarse strainer belongs there) */
  strainerMinMicron: bounded(1, 1000, 'µm').optional(),
})
export type ThresholdSettings = z.infer<typeof thresholdSettings>

export const circuitSettings = z.strictObject({
  allowance: allowanceSetting,
  /** where z = 0 is, in words the workshop can find on the vehicle */
  datum: labelText('Datum description', 200),
  thresholds: thresholdSettings.optional(),
  coolant: coolantSettings.optional(),
  fuel: fuelSettings.optional(),
})
export type CircuitSettings = z.infer<typeof circuitSettings>
