// Grid spacing and scale bar in round numbers (the 1–2–5 series drawing offices use), adapting to zoom.

/** The smallest of 1, 2, 5 × 10ⁿ mm that is at least `minMm`. */
export function niceStep(minMm: number): number {
  if (!(minMm > 0) || !Number.isFinite(minMm)) return 1
  const exp = Math.floor(Math.log10(minMm))
  for (const e of [exp, exp + 1]) {
    for (const m of [1, 2, 5]) {
      const step = m * 10 ** e
      if (step >= minMm * (1 - 1e-9)) return Number(step.toPrecision(12))
    }
  }
  return 10 ** (exp + 1)
}

/**
 * Minor grid lines at least `minMinorPx` apart on screen; major lines every 5 minor steps for a
 * 1 or 2 step, every 10 for a 5 step, so majors also land on round numbers (5, 10, 50, 100, …).
 */
export function gridSteps(scale: number, minMinorPx = 12): { minor: number; major: number } {
  const minor = niceStep(minMinorPx / scale)
  const mantissa = Math.round(minor / 10 ** Math.floor(Math.log10(minor) + 1e-9))
  return { minor, major: mantissa === 5 ? minor * 10 : minor * 5 }
}

/** Grid values between lo and hi (at most `limit` of them), as multiples of step. */
export function gridValues(lo: number, hi: number, step: number, limit = 2000): number[] {
  const out: number[] = []
  const first = Math.ceil(lo / step)
  const last = Math.floor(hi / step)
  if (last - first > limit) return out
  for (let i = first; i <= last; i++) out.push(Number((i * step).toPrecision(12)))
  return out
}

/** A length in the drawing's words: "250 mm", "1.5 m". */
export function formatLengthMm(mm: number): string {
  if (Math.abs(mm) >= 1000) return `${Number((mm / 1000).toPrecision(6))} m`
  return `${Number(mm.toPrecision(6))} mm`
}

/** A scale bar of a round length whose screen length is close to, and not above, `targetPx`. */
export function scaleBar(scale: number, targetPx = 120): { lengthMm: number; px: number; label: string } {
  const raw = targetPx / scale
  let lengthMm = niceStep(raw)
  if (lengthMm > raw * (1 + 1e-9)) {
    // step down to the previous 1–2–5 value so the bar does not overrun its space
    const exp = Math.floor(Math.log10(lengthMm) + 1e-9)
    const m = Math.round(lengthMm / 10 ** exp)
    lengthMm = m === 1 ? 5 * 10 ** (exp - 1) : m === 2 ? 10 ** exp : 2 * 10 ** exp
    lengthMm = Number(lengthMm.toPrecision(12))
  }
  return { lengthMm, px: lengthMm * scale, label: formatLengthMm(lengthMm) }
}

/** Snaps a value to the grid step. */
export const snapTo = (value: number, step: number) => Math.round(value / step) * step
