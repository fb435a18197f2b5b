// IAPWS-IF97 region 1 (compressed and saturated liquid water): specific volume from the
// dimensionless Gibbs free energy γ(π, τ).
// Source: IAPWS R7-97(2012), Eq. 7 and Table 2 (coefficients), Table 3 (derivatives of γ).
// Validity: 273.15 K ≤ T ≤ 623.15 K, ps(T) ≤ p ≤ 100 MPa.

const I = [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21, 23, 29, 30, 31, 32]
const J = [-2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10, -8, -11, -6, -29, -31, -38, -39, -40, -41]
const N = [
  0.14632971213167, -0.84548187169114, -0.37563603672040e1, 0.33855169168385e1, -0.95791963387872,
  0.15772038513228, -0.16616417199501e-1, 0.81214629983568e-3, 0.28319080123804e-3, -0.60706301565874e-3,
  -0.18990068218419e-1, -0.32529748770505e-1, -0.21841717175414e-1, -0.52838357969930e-4, -0.47184321073267e-3,
  -0.30001780793026e-3, 0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4,
  -0.28270797985312e-5, -0.85205128120103e-9, -0.22425281908000e-5, -0.65171222895601e-6, -0.14341729937924e-12,
  -0.40516996860117e-6, -0.12734301741641e-8, -0.17424871230634e-9, -0.68762131295531e-18, 0.14478307828521e-19,
  0.26335781662795e-22, -0.11947622640071e-22, 0.18228094581404e-23, -0.93537087292458e-25,
]

/** Specific gas constant of water used by IF97, kJ/(kg·K). */
const R = 0.461526
const P_STAR_MPA = 16.53
const T_STAR_K = 1386

export const IF97_REGION1_MAX_TEMPERATURE_K = 623.15

export interface Region1State {
  /** m³/kg */
  specificVolume: number
  /** kJ/kg */
  enthalpy: number
  /** kJ/(kg·K) */
  isobaricHeatCapacity: number
}

/** Region 1 properties at T in K and p in MPa (absolute). */
export function region1(temperatureK: number, pressureMpa: number): Region1State {
  if (!(temperatureK >= 273.15 && temperatureK <= IF97_REGION1_MAX_TEMPERATURE_K)) {
    throw new RangeError(`temperature ${temperatureK} K outside IAPWS-IF97 region 1`)
  }
  if (!(pressureMpa > 0 && pressureMpa <= 100)) throw new RangeError(`pressure ${pressureMpa} MPa outside IAPWS-IF97 region 1`)
  const pi = pressureMpa / P_STAR_MPA
  const tau = T_STAR_K / temperatureK
  const a = 7.1 - pi
  const b = tau - 1.222
  let gammaPi = 0
  let gammaTau = 0
  let gammaTauTau = 0
  for (let k = 0; k < N.length; k++) {
    const i = I[k]!
    const j = J[k]!
    const n = N[k]!
    gammaPi -= n * i * a ** (i - 1) * b ** j
    gammaTau += n * a ** i * j * b ** (j - 1)
    gammaTauTau += n * a ** i * j * (j - 1) * b ** (j - 2)
  }
  const rt = R * temperatureK // kJ/kg
  return {
    specificVolume: (pi * gammaPi * rt) / (pressureMpa * 1000),
    enthalpy: tau * gammaTau * rt,
    isobaricHeatCapacity: -R * tau * tau * gammaTauTau,
  }
}
