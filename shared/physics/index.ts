// Public API of the physics layer: fluids, friction, fittings and the network solver.
// Internal units are SI unless a name says otherwise (…Kpa, …Lpm, …C, …Mm); see docs/physics.md.

export type * from './types'

export {
  MM_PER_INCH, KG_PER_POUND, STANDARD_GRAVITY, LITRES_PER_US_GALLON, LITRES_PER_US_QUART, NEWTONS_PER_POUND_FORCE,
  PASCALS_PER_PSI, STANDARD_ATMOSPHERE_KPA, KPA_PER_BAR, KELVIN_OFFSET,
  celsiusToKelvin, kelvinToCelsius, celsiusToFahrenheit, fahrenheitToCelsius, psiToKpa, kpaToPsi, gaugeToAbsoluteKpa,
  METRIC_PREFERENCES, US_PREFERENCES, toDisplay, fromDisplay, displaySymbol, formatQuantity,
} from './units'
export type { LengthUnit, VolumeUnit, TemperatureUnit, PressureUnit, FlowUnit, UnitPreferences, Quantity, FormatOptions } from './units'

export { parseNominalSizeMm, nearestFractionalInch, formatNominalSize, sameNominalSize } from './hose-sizes'
export type { FractionalInch } from './hose-sizes'

export {
  saturationPressureMpa, saturationTemperatureK, saturationPressureKpa, saturationTemperatureC,
  IF97_CRITICAL_TEMPERATURE_K, IF97_CRITICAL_PRESSURE_MPA,
} from './if97-region4'
export { region1 as if97Region1 } from './if97-region1'
export type { Region1State } from './if97-region1'

export {
  waterDensity, waterDensityKell, waterViscosity, waterViscosityIapws2008, waterHeatCapacity, defaultLiquidPressureKpaAbs,
  WATER_MIN_TEMPERATURE_C, WATER_MAX_TEMPERATURE_C,
} from './water'

export {
  PURE_DENSITY_20C, MOLAR_MASS, MAX_GLYCOL_VOLUME_PERCENT, volumeToMassPercent, massToVolumePercent, waterMoleFraction, normaliseMix,
} from './glycol-mix'
export type { Glycol, NormalisedMix } from './glycol-mix'
export {
  melinderDensity, melinderViscosity, melinderHeatCapacity, melinderFreezePointC, MELINDER_MAX_MASS_PERCENT, MELINDER_MAX_TEMPERATURE_C,
} from './glycol-melinder'
export {
  freezePoint, freezePointC, ETHYLENE_GLYCOL_FREEZE_TABLE, PROPYLENE_GLYCOL_FREEZE_TABLE,
  ETHYLENE_GLYCOL_FREEZE_SOURCE, PROPYLENE_GLYCOL_FREEZE_SOURCE,
} from './glycol-freeze'
export type { FreezePoint } from './glycol-freeze'
export { coolantProperties, boilingPoint, boilingPointC, WATER_PROPERTIES_SOURCE } from './coolant'
export type { BoilingPoint } from './coolant'

export {
  LAMINAR_LIMIT_RE, TURBULENT_LIMIT_RE, laminarFrictionFactor, colebrookFrictionFactor, fullyRoughFrictionFactor,
  darcyFrictionFactor, frictionFactorWithSlope, velocityFromFlow, reynoldsNumber, darcyPressureDropPerMetre,
} from './friction'
export type { FrictionPoint, PipeFlowFluid, StraightPipeDrop } from './friction'

export {
  craneFullyTurbulentFrictionFactor, ROUGHNESS_M, CRANE_BEND_L_OVER_D, craneBendLOverD, bendK, suddenExpansionK,
  suddenContractionK, SHARP_ENTRANCE_K, EXIT_K, fittingK, totalMinorK,
} from './fittings'
export type { Fitting, FittingOptions } from './fittings'

export { solveNetwork } from './network/solve-network'
export type { SolveOptions } from './network/solve-network'
export { fitPumpCurve, QUADRATIC_LAW_LINEAR_BELOW_M3S } from './network/link-models'
export type { FrictionLaw } from './network/link-models'
