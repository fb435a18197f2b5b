// Shop outputs: what a technician buys and does for an analysed circuit. Pure functions of the
// document and the engine's report.
export { shoppingList, sectionTotals } from './shoppingList'
export { shoppingListCsv, shoppingLinesFromCsv, CSV_COLUMNS } from './csv'
export {
  bestCombination, chooseContainers, CONTAINER_RULE, DEFAULT_CONCENTRATE_CONTAINERS, DEFAULT_WATER_CONTAINERS,
  DEFAULT_TOP_UP_RESERVE_PERCENT, type ContainerChoice,
} from './containers'
export { fillAndBleedProcedure } from './fillAndBleed'
export { leakAndPrimeProcedure } from './leakAndPrime'
export { procedureFor } from './procedure'
export { volumeByPart, flowSplit, type ChartDatum } from './charts'
export { SHOP_SECTIONS, SECTION_TITLES } from './types'
export type {
  ShopSection, ShoppingLine, ShoppingList, ShoppingListOptions, SectionTotal, CustomLineInput, ContainerSize, DualText,
} from './types'
export type {
  Procedure, ProcedureResult, ProcedureKind, ProcedureStep, ProcedurePhase, StepKind, CoolantProcedure,
  CoolantProcedureFigures, UnavailableProcedure, FuelProcedure, FuelProcedureFigures,
} from './procedureTypes'
export { PROCEDURE_PHASE_TITLES } from './procedureTypes'
