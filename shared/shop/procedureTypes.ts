// Shapes of the procedures a technician follows. One generator per circuit kind; fuel circuits get a
// leak-and-prime procedure later, with its own phases and figures beside the coolant ones.

export type ProcedureKind = 'coolant-fill-and-bleed' | 'fuel-leak-and-prime'

export type StepKind = 'caution' | 'step' | 'check' | 'record'

/** Coolant phases; the fuel procedure adds its own ('leak-test', 'prime') when it arrives. */
export type ProcedurePhase = 'cautions' | 'prepare' | 'fill' | 'bleed' | 'warm-up' | 'top-up' | 'pressure-test'

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

/** Every procedure there is; a fuel procedure joins this union. */
export type Procedure = CoolantProcedure

export interface UnavailableProcedure {
  kind: ProcedureKind
  available: false
  title: string
  circuitTitle: string
  reason: string
}

export type ProcedureResult = Procedure | UnavailableProcedure
