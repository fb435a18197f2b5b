import type { CircuitSettings } from './settings'
import type { CircuitKindName } from './document'

/**
 * Settings of a circuit nobody has drawn yet. Starting points only, flagged in the editor as
 * "check against the engine maker's data": a 50 % ethylene-glycol mix and a cap near 1 bar are the
 * usual passenger-car case (common practice).
 */
export function emptyCircuitSettings(kind: CircuitKindName): CircuitSettings {
  const base: CircuitSettings = {
    allowance: { percent: 5, perEndMm: 25 },
    datum: 'Top face of the chassis rail, level ground',
  }
  if (kind !== 'coolant') return base
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
