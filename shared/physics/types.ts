// Contract between the circuit engine (shared/engine) and the physics layer (shared/physics).
// Units inside the physics layer are SI unless a name says otherwise (…Kpa, …Lpm, …C, …Mm).
// The physics layer knows nothing about circuits, components or hoses: only fluids and networks.

export type CoolantFluid = 'water' | 'ethylene-glycol' | 'propylene-glycol'

/** A coolant as the workshop states it: glycol concentrate as percent of the mixed volume. */
export interface CoolantMix {
  fluid: CoolantFluid
  /** 0–100, percent by volume of glycol concentrate in the mix; ignored for water. */
  percentByVolume: number
}

export interface FluidState {
  densityKgM3: number
  /** dynamic viscosity */
  viscosityPaS: number
  /** which formulation or table produced the figures, in words a reviewer can look up */
  source: string
  /** isobaric heat capacity, J/(kg·K), when the formulation provides it */
  heatCapacityJKgK?: number
  /** clamping or extrapolation a reviewer should know about; absent or empty when none */
  notes?: string[]
}

/** A link in a hydraulic network. Flow is positive from `from` to `to`. */
export type NetworkLink =
  | {
      kind: 'pipe'
      id: string
      from: string
      to: string
      lengthM: number
      diameterM: number
      roughnessM: number
      /** sum of minor-loss coefficients along the pipe, referred to this pipe's velocity */
      minorK: number
    }
  | {
      /** a lumped resistance: dp = K·ρv²/2 at the reference diameter, or a rated drop at a rated flow (dp ∝ Q²) */
      kind: 'resistance'
      id: string
      from: string
      to: string
      resistance: { k: number; diameterM: number } | { dropKpa: number; atFlowLpm: number }
    }
  | {
      kind: 'pump'
      id: string
      from: string
      to: string
      /** fixed volumetric flow, or a head–flow curve through three points (head in m of the pumped fluid) */
      pump: { fixedFlowLpm: number } | { curve: Array<{ flowLpm: number; headM: number }> }
    }

export interface NetworkNode {
  id: string
  elevationM: number
}

export interface Network {
  nodes: NetworkNode[]
  links: NetworkLink[]
  /** node whose pressure is held (the expansion tank or cap); gauge pressure there, kPa */
  referenceNode: string
  referencePressureKpa?: number
  fluid: FluidState
}

export interface LinkResult {
  id: string
  flowLpm: number
  velocityMS: number | null
  reynolds: number | null
  frictionFactor: number | null
  /** pressure drop in the direction of positive flow, kPa (negative across a pump = rise) */
  dropKpa: number
  /**
   * the part of dropKpa due to friction and fittings (ρ·g·head loss), kPa; dropKpa also contains the
   * static change ρ·g·(z_to − z_from). Negative across a pump: its pressure rise.
   */
  headLossKpa?: number
}

export interface NetworkResult {
  converged: boolean
  iterations: number
  links: LinkResult[]
  /** node gauge pressures, kPa; nodes listed in isolatedNodes have no pressure level and are absent */
  nodePressureKpa: Record<string, number>
  /** nodes not connected to the reference node, or links that carry no defined flow */
  isolatedNodes: string[]
  message?: string
  /** the same findings, one entry per kind, for callers that act on them (absent when there are none) */
  problems?: NetworkProblem[]
}

export interface NetworkProblem {
  kind: 'no-reference' | 'isolated-nodes' | 'invalid-link' | 'no-return-path' | 'pump-curve' | 'not-converged'
  /** node or link ids concerned */
  ids: string[]
  message: string
}
