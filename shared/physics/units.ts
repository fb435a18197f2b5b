// Exact unit definitions and the conversions the UI needs between internal units
// (mm, L, °C, kPa, L/min) and the user's display preferences.
// Every factor below is an exact definition, not a measured value; the tests name the standard for each.

/** 1 in = 25.4 mm exactly (international yard and pound agreement, 1959). */
export const MM_PER_INCH = 25.4
/** 1 lb = 0.45359237 kg exactly (same agreement). */
export const KG_PER_POUND = 0.45359237
/** Standard gravity, 9.80665 m/s² exactly (3rd CGPM, 1901). */
export const STANDARD_GRAVITY = 9.80665
/** 1 US gallon = 231 in³ exactly = 3.785411784 L. */
export const LITRES_PER_US_GALLON = 3.785411784
/** 1 US liquid quart = 1/4 US gallon. */
export const LITRES_PER_US_QUART = LITRES_PER_US_GALLON / 4
/** 1 lbf = 1 lb × standard gravity. */
export const NEWTONS_PER_POUND_FORCE = KG_PER_POUND * STANDARD_GRAVITY
/** 1 psi = 1 lbf/in² = 6894.757293168… Pa. */
export const PASCALS_PER_PSI = NEWTONS_PER_POUND_FORCE / (MM_PER_INCH / 1000) ** 2
/** Standard atmosphere, 101 325 Pa exactly (10th CGPM, 1954). */
export const STANDARD_ATMOSPHERE_KPA = 101.325
/** 1 bar = 100 kPa exactly. */
export const KPA_PER_BAR = 100
/** K = °C + 273.15 exactly. */
export const KELVIN_OFFSET = 273.15

export const celsiusToKelvin = (c: number): number => c + KELVIN_OFFSET
export const kelvinToCelsius = (k: number): number => k - KELVIN_OFFSET
export const celsiusToFahrenheit = (c: number): number => 1.8 * c + 32
export const fahrenheitToCelsius = (f: number): number => (f - 32) / 1.8
export const psiToKpa = (psi: number): number => (psi * PASCALS_PER_PSI) / 1000
export const kpaToPsi = (kpa: number): number => (kpa * 1000) / PASCALS_PER_PSI
/** Absolute pressure of a gauge reading taken at sea-level standard atmosphere. */
export const gaugeToAbsoluteKpa = (gaugeKpa: number): number => gaugeKpa + STANDARD_ATMOSPHERE_KPA

export type LengthUnit = 'mm' | 'in'
export type VolumeUnit = 'L' | 'qt'
export type TemperatureUnit = 'C' | 'F'
export type PressureUnit = 'kPa' | 'bar' | 'psi'
export type FlowUnit = 'L/min' | 'gal/min'

export interface UnitPreferences {
  length: LengthUnit
  volume: VolumeUnit
  temperature: TemperatureUnit
  pressure: PressureUnit
  flow: FlowUnit
}

export const METRIC_PREFERENCES: UnitPreferences = { length: 'mm', volume: 'L', temperature: 'C', pressure: 'kPa', flow: 'L/min' }
export const US_PREFERENCES: UnitPreferences = { length: 'in', volume: 'qt', temperature: 'F', pressure: 'psi', flow: 'gal/min' }

export type Quantity = 'length' | 'volume' | 'temperature' | 'temperatureDifference' | 'pressure' | 'flow'

type Unit = LengthUnit | VolumeUnit | TemperatureUnit | PressureUnit | FlowUnit

interface Conversion {
  /** internal value → display value */
  to: (v: number) => number
  /** display value → internal value */
  from: (v: number) => number
  symbol: string
  /** decimals that make a reading useful without pretending precision */
  decimals: number
}

const identity = (v: number): number => v
const scale = (factor: number, symbol: string, decimals: number): Conversion => ({
  to: v => v / factor,
  from: v => v * factor,
  symbol,
  decimals,
})

// Internal units: mm, L, °C, kPa (gauge unless named otherwise), L/min.
const CONVERSIONS: Record<Quantity, Partial<Record<Unit, Conversion>>> = {
  length: {
    mm: { to: identity, from: identity, symbol: 'mm', decimals: 1 },
    in: scale(MM_PER_INCH, 'in', 2),
  },
  volume: {
    L: { to: identity, from: identity, symbol: 'L', decimals: 2 },
    qt: scale(LITRES_PER_US_QUART, 'qt', 2),
  },
  temperature: {
    C: { to: identity, from: identity, symbol: '°C', decimals: 1 },
    F: { to: celsiusToFahrenheit, from: fahrenheitToCelsius, symbol: '°F', decimals: 0 },
  },
  temperatureDifference: {
    C: { to: identity, from: identity, symbol: 'K', decimals: 1 },
    F: scale(1 / 1.8, '°F', 1),
  },
  pressure: {
    kPa: { to: identity, from: identity, symbol: 'kPa', decimals: 1 },
    bar: scale(KPA_PER_BAR, 'bar', 2),
    psi: { to: kpaToPsi, from: psiToKpa, symbol: 'psi', decimals: 1 },
  },
  flow: {
    'L/min': { to: identity, from: identity, symbol: 'L/min', decimals: 1 },
    'gal/min': scale(LITRES_PER_US_GALLON, 'gal/min', 2),
  },
}

function unitFor(quantity: Quantity, prefs: UnitPreferences): Unit {
  switch (quantity) {
    case 'length': return prefs.length
    case 'volume': return prefs.volume
    case 'temperature':
    case 'temperatureDifference': return prefs.temperature
    case 'pressure': return prefs.pressure
    case 'flow': return prefs.flow
  }
}

function conversion(quantity: Quantity, unit: Unit): Conversion {
  const c = CONVERSIONS[quantity][unit]
  if (!c) throw new Error(`unit ${unit} does not measure ${quantity}`)
  return c
}

/** Internal value → value in the user's unit. */
export function toDisplay(quantity: Quantity, internalValue: number, prefs: UnitPreferences): number {
  return conversion(quantity, unitFor(quantity, prefs)).to(internalValue)
}

/** Value typed in the user's unit → internal value. */
export function fromDisplay(quantity: Quantity, displayValue: number, prefs: UnitPreferences): number {
  return conversion(quantity, unitFor(quantity, prefs)).from(displayValue)
}

export function displaySymbol(quantity: Quantity, prefs: UnitPreferences): string {
  return conversion(quantity, unitFor(quantity, prefs)).symbol
}

export interface FormatOptions {
  /** overrides the default decimals for the unit */
  decimals?: number
  /** omit the unit symbol */
  bare?: boolean
}

/** Internal value → text in the user's unit, e.g. "120.9 °C" or "15.0 psi". */
export function formatQuantity(quantity: Quantity, internalValue: number, prefs: UnitPreferences, options: FormatOptions = {}): string {
  const c = conversion(quantity, unitFor(quantity, prefs))
  if (!Number.isFinite(internalValue)) return '—'
  const decimals = options.decimals ?? c.decimals
  let text = c.to(internalValue).toFixed(decimals)
  // "-0.0" reads as a sign error on a shop printout
  if (/^-0(\.0+)?$/.test(text)) text = text.slice(1)
  return options.bare ? text : `${text} ${c.symbol}`
}
