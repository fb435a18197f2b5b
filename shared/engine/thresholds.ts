import type { ThresholdSettings } from '../circuit'

/**
 * Defaults for every check threshold. Each can be overridden in circuit.settings.thresholds.
 * Sources and reasons are in docs/engine.md; the short form is beside each value.
 */
export const DEFAULT_THRESHOLDS = {
  /** common practice: keep the boiling point under the cap at least 10 K above the hottest allowed coolant */
  boilMarginK: 10,
  /** common practice: hose velocity above about 3 m/s (10 ft/s) erodes and cavitates */
  maxVelocityMS: 3,
  /** our default: a heat-exchanger branch under 2 L/min is starved (a heater then blows cold) */
  minBranchFlowLpm: 2,
  /** a rise and a fall must each exceed this before a high point counts, so drawing noise is ignored */
  airTrapToleranceMm: 25,
  /** common practice: a hose must not be clamped down onto a spigot more than this smaller than its bore */
  fitLooseMm: 0.25,
  /** common practice: a hose may be stretched over a spigot up to this much larger than its bore */
  fitStretchPercent: 8,
  /** common practice: a fuel pump sized about 20 % above the engine's demand (wear, low voltage, hot fuel) */
  fuelPumpMarginPercent: 20,
  /** our default, in line with common hydraulic practice for suction lines: above about 1.5 m/s an inline pump's inlet starves and the fuel vapours */
  fuelSuctionVelocityMS: 1.5,
  /** our default, common practice for pressure lines: above about 3 m/s the line's own drop eats into the pump's margin */
  fuelSupplyVelocityMS: 3,
  /** our default, common practice: a return above about 2 m/s back-pressures the regulator and the rail pressure creeps up at idle */
  fuelReturnVelocityMS: 2,
  /** common practice: an EFI filter after the pump is about 10 µm; 40 µm or finer still protects the injectors */
  fineFilterMicron: 40,
  /** common practice: a pre-pump strainer or sock is about 70–100 µm; anything finer restricts the pump's inlet */
  strainerMinMicron: 70,
} as const satisfies Required<ThresholdSettings>

export type Thresholds = { [K in keyof typeof DEFAULT_THRESHOLDS]: number }

export function resolveThresholds(given: ThresholdSettings | undefined): Thresholds {
  return { ...DEFAULT_THRESHOLDS, ...Object.fromEntries(Object.entries(given ?? {}).filter(([, v]) => v !== undefined)) }
}
