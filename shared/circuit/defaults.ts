import type { CircuitSettings, FuelSettings } from './settings'
import type { CircuitKindName } from './document'

/**
 * What a new fuel circuit asks of its fuel system until the fabricator enters the engine's own
 * figures: petrol; about 110 kW (150 hp) at a BSFC of 0.50 lb/(hp·h), the top of the usual 0.45–0.50
 * for an engine without boost (304 g/kWh); injectors open at most 80 % of the time (the trade's
 * 0.80–0.85); no boost. All common practice (check-values §7).
 */
export const DEFAULT_FUEL_SETTINGS: FuelSettings = {
  fuel: 'petrol',
  targetPowerKw: 110,
  bsfcGPerKwh: 304,
  maxInjectorDutyPercent: 80,
  maxBoostKpa: 0,
}

/**
 * Settings of a circuit nobody has drawn yet. Starting points only, flagged in the editor as
 * "check against the engine maker's data": a 50 % ethylene-glycol mix and a cap near 1 bar are the
 * usual passenger-car case (common practice); a fuel circuit starts from DEFAULT_FUEL_SETTINGS.
 */
export function emptyCircuitSettings(kind: CircuitKindName): CircuitSettings {
  const base: CircuitSettings = {
    allowance: { percent: 5, perEndMm: 25 },
    datum: 'Top face of the chassis rail, level ground',
  }
  if (kind === 'fuel') return { ...base, fuel: { ...DEFAULT_FUEL_SETTINGS } }
  return {
    ...base,
    coolant: {
      mix: { fluid: 'ethylene-glycol', percentByVolume: 50 },
      capRatingKpa: 100,
      maxCoolantTempC: 110,
      minAmbientC: -25,
      pump: { mode: 'fixed', flowLpm: 80, atRpm: 3000 },
    },
  }
}
