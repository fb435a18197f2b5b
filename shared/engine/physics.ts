// The one place the engine reaches into the physics layer, so a change of its API touches one file.
export {
  boilingPoint, coolantProperties, freezePoint, solveNetwork, bendK, craneFullyTurbulentFrictionFactor,
  ROUGHNESS_M, SHARP_ENTRANCE_K, EXIT_K, QUADRATIC_LAW_LINEAR_BELOW_M3S, STANDARD_GRAVITY, darcyPressureDropPerMetre,
  kpaToPsi,
} from '../physics'
export type { CoolantMix, FluidState, Network, NetworkLink, NetworkNode, NetworkResult, LinkResult } from '../physics'
export {
  fuelProperties, kwToHp, bsfcToLbPerHpH, injectorFlowAt, ccPerMinToLbPerHour, litresPerHourToCcPerMin,
  ccPerMinToLitresPerHour, litresPerHourToUsGallonsPerHour,
} from '../physics/fuel'
export type { FuelProperties } from '../physics/fuel'
