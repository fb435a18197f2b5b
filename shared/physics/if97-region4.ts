// IAPWS-IF97 region 4: the saturation line of water.
// Source: IAPWS R7-97(2012), "Revised Release on the IAPWS Industrial Formulation 1997 for the
// Thermodynamic Properties of Water and Steam", Eqs. 30 (ps(T)) and 31 (Ts(p)), coefficients Table 34.
// Validity: 273.15 K ≤ T ≤ 647.096 K, 611.213 Pa ≤ p ≤ 22.064 MPa.

/** Table 34 of IAPWS R7-97(2012). */
const N = [
  0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.12020824702470e5, -0.32325550322333e7,
  0.14915108613530e2, -0.48232657361591e4, 0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
] as const

export const IF97_CRITICAL_TEMPERATURE_K = 647.096
export const IF97_CRITICAL_PRESSURE_MPA = 22.064
export const IF97_REGION4_MIN_TEMPERATURE_K = 273.15
/** ps(273.15 K) = 611.212677 Pa; the release quotes it rounded as 611.213 Pa */
export const IF97_REGION4_MIN_PRESSURE_MPA = 611.212677e-6

const [n1, n2, n3, n4, n5, n6, n7, n8, n9, n10] = N

function assertRange(value: number, min: number, max: number, what: string): void {
  // a tiny slack so that the documented end points themselves round-trip
  if (!(value >= min * (1 - 1e-12) && value <= max * (1 + 1e-12))) {
    throw new RangeError(`${what} ${value} outside IAPWS-IF97 region 4 (${min} … ${max})`)
  }
}

/** Saturation pressure in MPa at temperature T in K (IF97 Eq. 30). */
export function saturationPressureMpa(temperatureK: number): number {
  assertRange(temperatureK, IF97_REGION4_MIN_TEMPERATURE_K, IF97_CRITICAL_TEMPERATURE_K, 'temperature (K)')
  const t = temperatureK // T* = 1 K
  const theta = t + n9 / (t - n10)
  const a = theta * theta + n1 * theta + n2
  const b = n3 * theta * theta + n4 * theta + n5
  const c = n6 * theta * theta + n7 * theta + n8
  const ratio = (2 * c) / (-b + Math.sqrt(b * b - 4 * a * c))
  return ratio ** 4 // p* = 1 MPa
}

/** Saturation temperature in K at pressure p in MPa (IF97 Eq. 31). */
export function saturationTemperatureK(pressureMpa: number): number {
  assertRange(pressureMpa, IF97_REGION4_MIN_PRESSURE_MPA, IF97_CRITICAL_PRESSURE_MPA, 'pressure (MPa)')
  const beta = pressureMpa ** 0.25
  const e = beta * beta + n3 * beta + n6
  const f = n1 * beta * beta + n4 * beta + n7
  const g = n2 * beta * beta + n5 * beta + n8
  const d = (2 * g) / (-f - Math.sqrt(f * f - 4 * e * g))
  return (n10 + d - Math.sqrt((n10 + d) ** 2 - 4 * (n9 + n10 * d))) / 2
}

/** Saturation pressure in kPa (absolute) at a temperature in °C. */
export function saturationPressureKpa(tempC: number): number {
  return saturationPressureMpa(tempC + 273.15) * 1000
}

/** Boiling temperature of pure water in °C at an absolute pressure in kPa. */
export function saturationTemperatureC(pressureKpaAbs: number): number {
  return saturationTemperatureK(pressureKpaAbs / 1000) - 273.15
}
