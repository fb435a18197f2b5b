export interface HoseFlow {
  hoseId: string
  tag: string
  /** positive from the hose's `from` end to its `to` end */
  flowLpm: number
  velocityMS: number
  reynolds: number
  /** pressure drop along the hose in the direction of flow, kPa */
  dropKpa: number
  /** false for a hose on a branch that leads nowhere (its flow is zero by conservation) */
  carriesFlow: boolean
}

export type BranchKind = 'radiator' | 'heater' | 'bypass' | 'vent' | 'pump' | 'other'

export interface BranchFlow {
  kind: BranchKind
  label: string
  componentIds: string[]
  hoseIds: string[]
  tags: string[]
  /** magnitude; every hose on the branch carries it */
  flowLpm: number
  /** of the pump's flow, 0–1 */
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
      /** pressure rise across the pump, kPa */
      pumpRiseKpa: number
      /** where the tank holds the pressure */
      referenceText: string
      hoses: HoseFlow[]
      branches: BranchFlow[]
      /** parts whose resistance is a typical default, not a data-sheet figure */
      defaultedComponentIds: string[]
      notes: string[]
    }
  | { solved: false; state: 'open' | 'closed'; reason: string }
