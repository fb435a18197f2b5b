// Shapes of the procedures a technician follows. One generator per circuit kind: a coolant circuit's
// fill and bleed, a fuel circuit's leak test and prime, each with its own figures.

export type ProcedureKind = 'coolant-fill-and-bleed' | 'fuel-leak-and-prime'

export type StepKind = 'caution' | 'step' | 'check' | 'record'

/**
 * Phases in the order a procedure can run through them. Coolant uses cautions, prepare, fill, bleed,
 * warm-up, top-up and pressure-test; fuel uses cautions, prepare, fill (the tank), prime, leak-test
 * and warm-up (the first start).
 */
export type ProcedurePhase = 'cautions' | 'prepare' | 'fill' | 'bleed' | 'prime' | 'leak-test' | 'warm-up' | 'top-up' | 'pressure-test'

/** Each phase's heading, for pages and printouts. */
export const PROCEDURE_PHASE_TITLES: Record<ProcedurePhase, string> = {
  cautions: 'Cautions', prepare: 'Prepare', fill: 'Fill', bleed: 'Bleed', prime: 'Prime', 'leak-test': 'Leak test',
  'warm-up': 'Warm up', 'top-up': 'Top up', 'pressure-test': 'Pressure test',
}

export interface ProcedureStep {
  /** stable: made from the phase and the ids of the parts concerned */
  id: string
  phase: ProcedurePhase
  kind: StepKind
  text: string
  /** trade practice rather than a figure computed from the drawing; the text says "rule of thumb" too */
  ruleOfThumb?: true
  /** parts, ports and hoses the step concerns */
  elementIds: string[]
}

export interface CoolantProcedureFigures {
  /** the report's system volume */
  fillVolumeL: number
  fillVolumeUsQuarts: number
  /** stamped start-to-open of each thermostat, °C */
  thermostatOpeningC: number[]
  /** the pressure to test at: the lowest fitted cap rating (gauge), kPa; null when the drawing has no cap */
  testPressureKpa: number | null
  /** where to fill; null when the drawing has no filler */
  fillerId: string | null
  /** how the engine is run while bleeding */
  layout: 'pressurised-tank' | 'open-filler' | 'no-filler'
  /** bleed points in the order they are opened (lowest first): port ids, or the part's id */
  bleedOrder: string[]
}

export interface CoolantProcedure {
  kind: 'coolant-fill-and-bleed'
  available: true
  title: string
  circuitTitle: string
  engineVersion: string
  steps: ProcedureStep[]
  figures: CoolantProcedureFigures
}

export interface FuelProcedureFigures {
  /**
   * what the system is leak-tested at: the regulator's base pressure, which the rail holds with the
   * pump running and the engine off (the manifold is at atmosphere), gauge kPa; null without a regulator
   */
  testPressureKpa: number | null
  /** rail pressure at full boost when the regulator follows boost 1:1; null without boost or reference */
  fullBoostPressureKpa: number | null
  /** return-style: fuel runs back to the tank all the time */
  returnStyle: boolean
  /** fuel the lines and parts hold once primed (the report's volume), L */
  linesVolumeL: number
  /** hoses whose two ends are checked, in the report's order */
  jointHoseIds: string[]
}

export interface FuelProcedure {
  kind: 'fuel-leak-and-prime'
  available: true
  title: string
  circuitTitle: string
  engineVersion: string
  steps: ProcedureStep[]
  figures: FuelProcedureFigures
}

/** Every procedure there is: one per circuit kind. */
export type Procedure = CoolantProcedure | FuelProcedure

export interface UnavailableProcedure {
  kind: ProcedureKind
  available: false
  title: string
  circuitTitle: string
  reason: string
}

export type ProcedureResult = Procedure | UnavailableProcedure
