// Sizes written in both unit systems. Every factor is an exact definition from the physics layer
// (1 in = 25.4 mm, 1 US gal = 3.785411784 L, 1 psi = 6.894757293168 kPa); only the wording is here.
import { nearestFractionalInch } from '../physics/hose-sizes'
import { KPA_PER_BAR, LITRES_PER_US_GALLON, LITRES_PER_US_QUART, MM_PER_INCH, celsiusToFahrenheit, kpaToPsi } from '../physics/units'
import type { DualText } from './types'

/** 1 ft = 12 in exactly. */
export const MM_PER_FOOT = MM_PER_INCH * 12

/** A number as a fabricator writes it: at most `decimals` places, no trailing zeros, never "-0". */
export function num(n: number, decimals = 2): string {
  const s = String(Number(n.toFixed(decimals)))
  return s === '-0' ? '0' : s
}

/** "1 piece", "6 pieces" */
export const pieces = (n: number): DualText => {
  const t = `${n} ${n === 1 ? 'piece' : 'pieces'}`
  return { metric: t, imperial: t }
}

export const mmText = (mm: number): string => `${num(mm)} mm`

/**
 * The nearest 1/16 in for a size in mm, marked "≈" when the metric size is not that fraction
 * (a 32 mm spigot is "≈ 1-1/4 in"; a 31.75 mm one is "1-1/4 in"). Sizes in the drawing carry two
 * decimals, so within 0.01 mm counts as the fraction itself.
 */
export function inchText(mm: number): string {
  const f = nearestFractionalInch(mm)
  return Math.abs(f.differenceMm) <= 0.01 ? f.label : `≈ ${f.label}`
}

/** "31.75 → 25 mm" style chains of sizes, in the order given. */
export function sizeChain(mms: readonly number[], suffix = ''): DualText {
  return {
    metric: `${mms.map((d) => num(d)).join(' → ')} mm${suffix}`,
    imperial: `${mms.map((d) => inchText(d).replace(/ in$/, '')).join(' → ')} in${suffix}`,
  }
}

export const boreSizes = (mm: number): DualText => ({ metric: `${mmText(mm)} bore`, imperial: `${inchText(mm)} bore` })

/** A range as "17–32 mm" / "11/16–1-1/4 in". */
export function rangeSizes(minMm: number, maxMm: number): DualText {
  const lo = nearestFractionalInch(minMm)
  const hi = nearestFractionalInch(maxMm)
  const approx = Math.abs(lo.differenceMm) > 0.01 || Math.abs(hi.differenceMm) > 0.01 ? '≈ ' : ''
  const strip = (t: string) => t.replace(/ in$/, '')
  return { metric: `${num(minMm)}–${num(maxMm)} mm`, imperial: `${approx}${strip(lo.label)}–${strip(hi.label)} in` }
}

/**
 * A cut length in inches, rounded UP to the next 1/8 in: a piece cut to the rounded figure is never
 * short. Feet are added from 3 ft up: "163-1/2 in (13 ft 7-1/2 in)".
 */
export function cutLengthInches(mm: number): string {
  const eighths = Math.ceil((mm / MM_PER_INCH) * 8 - 1e-9)
  const label = eighthsLabel(eighths)
  if (eighths < 36 * 8) return `${label} in`
  const feet = Math.floor(eighths / 96)
  const rest = eighths - feet * 96
  return `${label} in (${feet} ft${rest > 0 ? ` ${eighthsLabel(rest)} in` : ''})`
}

function eighthsLabel(eighths: number): string {
  const whole = Math.floor(eighths / 8)
  let n = eighths % 8
  let d = 8
  while (n > 0 && n % 2 === 0) { n /= 2; d /= 2 }
  if (n === 0) return String(whole)
  return whole > 0 ? `${whole}-${n}/${d}` : `${n}/${d}`
}

export const metresText = (m: number): DualText => ({ metric: `${num(m, 3)} m`, imperial: `${num((m * 1000) / MM_PER_FOOT)} ft` })

export const litresToUsQuarts = (litres: number): number => litres / LITRES_PER_US_QUART
export const litresToUsGallons = (litres: number): number => litres / LITRES_PER_US_GALLON

export const volumeText = (litres: number): DualText => ({
  metric: `${num(litres)} L`,
  imperial: `${num(litresToUsQuarts(litres))} US qt`,
})

/** °C and whole °F (thermostats are stamped in whole degrees). */
export const temperatureText = (c: number): DualText => ({ metric: `${num(c, 1)} °C`, imperial: `${num(celsiusToFahrenheit(c), 0)} °F` })

/** A gauge pressure as "1.1 bar (110 kPa)" / "16 psi" (one decimal of psi at most). */
export const pressureText = (kpa: number): DualText => ({
  metric: `${num(kpa / KPA_PER_BAR, 2)} bar (${num(kpa, 1)} kPa)`,
  imperial: `${num(kpaToPsi(kpa), 1)} psi`,
})

/** Line ids are built from these: lower case, digits, dots and dashes. */
export function slug(text: string): string {
  return text
    .toLowerCase()
    .replace(/→/g, 'to')
    .replace(/[^a-z0-9.]+/g, '-')
    .replace(/^-+|-+$/g, '')
}

export function capitalise(text: string): string {
  return text.length > 0 ? text[0]!.toUpperCase() + text.slice(1) : text
}
