// The one place the engine reaches into the physics layer, so a change of its API touches one file.
export {
  boilingPoint, coolantProperties, freezePoint, solveNetwork, bendK, craneFullyTurbulentFrictionFactor,
  ROUGHNESS_M, SHARP_ENTRANCE_K, EXIT_K,
} from '../physics'
export type { CoolantMix, FluidState, Network, NetworkLink, NetworkNode, NetworkResult, LinkResult } from '../physics'
