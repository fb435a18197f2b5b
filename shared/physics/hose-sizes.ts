// Nominal hose sizes: workshops name hose bores as inch fractions ("5/16 in", "1-1/2\"") or as
// millimetres ("8 mm"). These helpers turn such labels into mm and back.

import { MM_PER_INCH } from './units'

const INCH_SUFFIX = /\s*(?:in(?:ch(?:es)?)?\.?|"|″|'')\s*$/i
const MM_SUFFIX = /\s*mm\s*$/i

function parseInchNumber(text: string): number | null {
  const t = text.trim()
  // "1-1/2", "1 1/2"
  let m = /^(\d+)(?:\s*-\s*|\s+)(\d+)\s*\/\s*(\d+)$/.exec(t)
  if (m) {
    const den = Number(m[3])
    return den > 0 ? Number(m[1]) + Number(m[2]) / den : null
  }
  // "5/16"
  m = /^(\d+)\s*\/\s*(\d+)$/.exec(t)
  if (m) {
    const den = Number(m[2])
    return den > 0 ? Number(m[1]) / den : null
  }
  // "0.75", "2"
  m = /^(\d+(?:\.\d*)?|\.\d+)$/.exec(t)
  return m ? Number(m[1]) : null
}

/**
 * Parses a nominal size label into mm. Accepts "5/16 in", "5/16\"", "1-1/2 in", "1 1/2in", "0.75 in",
 * "8 mm", "9.5mm". A bare fraction is read as inches; a bare decimal number as mm.
 * Returns null when the text is not a size.
 */
export function parseNominalSizeMm(label: string): number | null {
  const text = label.trim().replace(',', '.')
  if (text === '') return null
  if (MM_SUFFIX.test(text)) {
    const n = text.replace(MM_SUFFIX, '').trim()
    if (!/^(\d+(?:\.\d*)?|\.\d+)$/.test(n)) return null
    const mm = Number(n)
    return mm > 0 ? mm : null
  }
  if (INCH_SUFFIX.test(text)) {
    const inches = parseInchNumber(text.replace(INCH_SUFFIX, ''))
    return inches !== null && inches > 0 ? inches * MM_PER_INCH : null
  }
  if (text.includes('/')) {
    const inches = parseInchNumber(text)
    return inches !== null && inches > 0 ? inches * MM_PER_INCH : null
  }
  const mm = parseInchNumber(text)
  return mm !== null && mm > 0 ? mm : null
}

function gcd(a: number, b: number): number {
  while (b) [a, b] = [b, a % b]
  return a
}

export interface FractionalInch {
  /** e.g. "5/16 in", "1-1/2 in", "2 in" */
  label: string
  /** the label's exact size */
  mm: number
  /** mm asked for minus the label's size */
  differenceMm: number
}

/**
 * Nearest inch fraction (to 1/denominator in, reduced) for a size in mm, e.g. 7.94 → "5/16 in".
 * Hose is sold in 1/16 in steps, hence the default.
 */
export function nearestFractionalInch(mm: number, denominator = 16): FractionalInch {
  if (!(mm > 0) || !Number.isFinite(mm)) throw new Error(`size must be a positive number of mm, got ${mm}`)
  const steps = Math.max(1, Math.round((mm / MM_PER_INCH) * denominator))
  const whole = Math.floor(steps / denominator)
  let num = steps % denominator
  let den = denominator
  if (num > 0) {
    const g = gcd(num, den)
    num /= g
    den /= g
  }
  const fraction = num > 0 ? `${num}/${den}` : ''
  const label = whole > 0 && fraction ? `${whole}-${fraction} in` : `${whole > 0 ? whole : fraction} in`
  const exact = (steps / denominator) * MM_PER_INCH
  return { label, mm: exact, differenceMm: mm - exact }
}

/** Label a bore the way the user prefers: "5/16 in" or "8 mm" (metric rounded to 0.5 mm below 10 mm). */
export function formatNominalSize(mm: number, unit: 'mm' | 'in'): string {
  if (unit === 'in') return nearestFractionalInch(mm).label
  const rounded = mm < 10 ? Math.round(mm * 2) / 2 : Math.round(mm)
  return `${rounded} mm`
}

/**
 * Whether two bores can be treated as the same size. The tolerance is the caller's choice:
 * it depends on the hose construction and the barb, so there is no default here.
 */
export function sameNominalSize(aMm: number, bMm: number, toleranceMm: number): boolean {
  return Math.abs(aMm - bMm) <= toleranceMm
}
