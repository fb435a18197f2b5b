// Size tables the checks and the shopping list use.

/**
 * SAE J1508 worm-drive clamp ranges, mm. From memory: typical catalogue values as listed in
 * /work/shared/reference/check-values.md §5 (tagged [M] there), not read from the standard itself.
 */
export const WORM_DRIVE_CLAMP_SIZES: ReadonlyArray<{ size: number; minMm: number; maxMm: number }> = [
  { size: 4, minMm: 6, maxMm: 16 },
  { size: 6, minMm: 8, maxMm: 22 },
  { size: 8, minMm: 11, maxMm: 25 },
  { size: 10, minMm: 13, maxMm: 29 },
  { size: 12, minMm: 17, maxMm: 32 },
  { size: 16, minMm: 19, maxMm: 38 },
  { size: 20, minMm: 19, maxMm: 44 },
  { size: 24, minMm: 27, maxMm: 51 },
  { size: 28, minMm: 33, maxMm: 57 },
  { size: 32, minMm: 40, maxMm: 64 },
  { size: 36, minMm: 46, maxMm: 70 },
  { size: 40, minMm: 52, maxMm: 76 },
  { size: 44, minMm: 59, maxMm: 83 },
  { size: 48, minMm: 64, maxMm: 89 },
  { size: 56, minMm: 78, maxMm: 102 },
  { size: 64, minMm: 89, maxMm: 114 },
  { size: 72, minMm: 103, maxMm: 127 },
]

/**
 * Worm-drive clamp for an assembled hose OD: of the sizes whose range holds the OD, the one whose
 * mid-range is nearest (common practice: size on the OD over the spigot and aim for mid-range).
 * Null when no size in the table fits.
 */
export function wormDriveClampFor(assembledOdMm: number): { size: number; minMm: number; maxMm: number } | null {
  let best: { size: number; minMm: number; maxMm: number } | null = null
  let bestGap = Infinity
  for (const s of WORM_DRIVE_CLAMP_SIZES) {
    if (assembledOdMm < s.minMm || assembledOdMm > s.maxMm) continue
    const gap = Math.abs((s.minMm + s.maxMm) / 2 - assembledOdMm)
    if (gap < bestGap - 1e-9) { best = s; bestGap = gap }
  }
  return best
}

/**
 * Common nominal hose bores, mm: inch sizes at their exact conversion (25.4 mm/in) and the usual metric
 * sizes. From memory (check-values §5, tagged [M]): used only to suggest a hose that fits a spigot.
 */
export const NOMINAL_HOSE_BORES_MM: readonly number[] = [
  4.76, 5, 6, 6.35, 7.94, 8, 9.53, 10, 12, 12.7, 13, 15.88, 16, 19, 19.05, 22, 25, 25.4, 28, 31.75, 32, 34.93, 35,
  38, 38.1, 41.28, 44.45, 45, 50.8, 51, 57.15, 63.5,
].slice().sort((a, b) => a - b)

export interface FitRule {
  looseMm: number
  stretchPercent: number
}

export type Fit = 'fits' | 'loose' | 'too-tight'

/**
 * Whether a hose bore suits a spigot. Common practice: a hose may be stretched a little over a larger
 * spigot, never clamped down onto a smaller one.
 */
export function hoseFit(boreMm: number, spigotOdMm: number, rule: FitRule): Fit {
  if (boreMm - spigotOdMm > rule.looseMm + 1e-9) return 'loose'
  if (spigotOdMm - boreMm > (boreMm * rule.stretchPercent) / 100 + 1e-9) return 'too-tight'
  return 'fits'
}

/** The largest common bore that fits a spigot (largest = least stretch), or null. */
export function nominalBoreFor(spigotOdMm: number, rule: FitRule): number | null {
  let best: number | null = null
  for (const b of NOMINAL_HOSE_BORES_MM) if (hoseFit(b, spigotOdMm, rule) === 'fits') best = b
  return best
}
