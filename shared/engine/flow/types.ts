export interface HoseFlow {
  hoseId: string
  tag: string
  /** positive from the hose's `from` end to its `to` end */
  flowLpm: number
  velocityMS: number
  reynolds: number
  /**
   * the hose's own loss, kPa: wall friction and the bends along its route, in the direction the
   * coolant flows. The parts' losses are not in it.
   */
  headLossKpa: number
  /**
   * the loss on the path inside the part at each end (from that end's port to the part's inside, or
   * back), kPa, in the direction of flow. Along any flow path from the pump's outlet back to its inlet,
   * the hoses' headLossKpa and these add up to the pump's rise.
   */
  partLossAtFromKpa: number
  partLossAtToKpa: number
  /** false for a hose on a branch that leads nowhere (its flow is zero by conservation) */
  carriesFlow: boolean
}

export interface PartFlow {
  componentId: string
  label: string
  /** the coolant passing through: what comes in by all its ports */
  flowLpm: number
  /**
   * pressure drop through the part, kPa: the loss from the port where coolant enters to the port where
   * it leaves (with several, the largest of each; the loss at each port is on the hose there). Friction
   * and fittings only; the height between ports is not in it. For the pump: the losses at its own
   * spigots.
   */
  dropKpa: number
}

/**
 * What a branch is: the heat exchanger or line on it, the pump, or where it runs:
 * `feed` from the pump's outlet to the first junction, `return` into the pump inlet, `run` between
 * two junctions.
 */
export type BranchKind = 'pump' | 'radiator' | 'heater' | 'bypass' | 'vent' | 'feed' | 'return' | 'run'

export interface BranchFlow {
  kind: BranchKind
  /** the parts along it in the direction of flow, from junction to junction: "Engine → Cab heater core → Water pump" */
  label: string
  /** the junctions it leaves and reaches, in the direction of flow */
  fromComponentId: string
  toComponentId: string
  /** the parts between its junctions */
  componentIds: string[]
  hoseIds: string[]
  tags: string[]
  /** magnitude; every hose on the branch carries it */
  flowLpm: number
  /** of the pump's flow, 0–1. Branches side by side add up to the flow where they split. */
  shareOfPump: number
}

export type FlowReport =
  | {
      solved: true
      state: 'open' | 'closed'
      temperatureC: number
      fluid: { densityKgM3: number; viscosityPaS: number; source: string }
      converged: boolean
      iterations: number
      pumpFlowLpm: number
      /** pressure rise across the pump, kPa; it equals the losses of hoses and parts along any flow path from its outlet back to its inlet */
      pumpRiseKpa: number
      /** where the tank holds the pressure */
      referenceText: string
      hoses: HoseFlow[]
      /** the parts on the loop, in stable order */
      parts: PartFlow[]
      /** pump first, then downstream in the order the coolant reaches them */
      branches: BranchFlow[]
      /** parts whose resistance is a typical default, not a data-sheet figure */
      defaultedComponentIds: string[]
      notes: string[]
    }
  | { solved: false; state: 'open' | 'closed'; reason: string }
