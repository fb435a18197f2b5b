// Colours and line styles of the drawing. The colours come from the app's Tailwind theme
// (tailwind.config.ts), passed in, so the canvas, the SVG export and the rest of the app agree.
import type { HoseMaterial } from '../circuit/hose'
import type { Severity } from '../engine/report'

export interface ThemeColours {
  ink: { DEFAULT: string; soft: string; muted: string; line: string }
  paper: { DEFAULT: string; raised: string; sunk: string }
  copper: { DEFAULT: string; dark: string; light: string }
  coolant: { DEFAULT: string; light: string }
  fuel: { DEFAULT: string; light: string }
  severity: Record<Severity, string>
}

export interface MaterialStyle {
  /** colour of the hose body */
  colour: string
  /** pattern of the thin centre line, px; empty = no centre line */
  centreDash: number[]
  /** one-word description for legends */
  words: string
}

export interface DrawingTheme {
  colours: ThemeColours
  background: string
  gridMinor: string
  gridMajor: string
  axis: string
  body: string
  accent: string
  stroke: string
  selection: string
  materials: Record<HoseMaterial, MaterialStyle>
  severity: Record<Severity, string>
}

export function drawingTheme(c: ThemeColours): DrawingTheme {
  const coolant = (centreDash: number[], words: string): MaterialStyle => ({ colour: c.coolant.DEFAULT, centreDash, words })
  const fuel = (centreDash: number[], words: string): MaterialStyle => ({ colour: c.fuel.DEFAULT, centreDash, words })
  return {
    colours: c,
    background: c.paper.raised,
    gridMinor: c.paper.sunk,
    gridMajor: c.ink.line,
    axis: c.ink.muted,
    body: c.paper.DEFAULT,
    accent: c.copper.light,
    stroke: c.ink.DEFAULT,
    selection: c.copper.DEFAULT,
    severity: c.severity,
    materials: {
      'j20-r4-radiator': coolant([], 'radiator hose'),
      'j20-r3-heater': coolant([7, 5], 'heater hose'),
      silicone: coolant([2, 4], 'silicone'),
      'j30-r6': fuel([7, 5], 'fuel hose R6'),
      'j30-r7': fuel([7, 5], 'fuel hose R7'),
      'j30-r9': fuel([], 'fuel hose R9'),
      'j30-r14': fuel([2, 4], 'fuel hose R14'),
      'j30-r10': fuel([4, 3], 'in-tank hose R10'),
      'ptfe-lined': fuel([10, 2, 2, 2], 'PTFE-lined hose'),
      'hard-line': { colour: c.ink.soft, centreDash: [14, 3], words: 'hard line' },
    },
  }
}

/** The on-screen stroke width of a hose: its bore to scale, never thinner than 2 px. */
export const hoseStrokePx = (boreMm: number, scale: number) => Math.max(2, boreMm * scale)
