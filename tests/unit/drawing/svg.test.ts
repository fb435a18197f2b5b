// The SVG export: well-formed, to scale in mm, in the view's projection, with the findings' marks.
import { describe, expect, it } from 'vitest'
import { demoDocument } from '#shared/demo'
import { analyzeCircuit } from '#shared/engine'
import { documentToSvg, drawingTheme, project, type ThemeColours } from '#shared/drawing'
import tailwind from '../../../tailwind.config'

const theme = drawingTheme(tailwind.theme.extend.colors as unknown as ThemeColours)

/** Every opened element closed in order (a small XML well-formedness check, enough for our output). */
function balanced(svg: string): boolean {
  const stack: string[] = []
  for (const m of svg.matchAll(/<(\/?)([a-z]+)[^>]*?(\/?)>/g)) {
    if (m[3]) continue
    if (m[1]) { if (stack.pop() !== m[2]) return false } else stack.push(m[2]!)
  }
  return stack.length === 0
}

describe('SVG export', () => {
  const doc = demoDocument()
  it('is well formed and escapes the title', () => {
    const tricky = { ...doc, circuit: { ...doc.circuit, title: 'Bay <2> & "rear"' } }
    const svg = documentToSvg(tricky, 'side', theme)
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true)
    expect(balanced(svg)).toBe(true)
    expect(svg).toContain('Bay &lt;2&gt; &amp; &quot;rear&quot;')
    expect(svg).not.toContain('<2>')
  })

  it('draws hoses to scale: the stroke is the bore in mm of the viewBox', () => {
    const svg = documentToSvg(doc, 'side', theme, { widthPx: 1600 })
    const strokes = [...svg.matchAll(/stroke-opacity="0.6" stroke-width="([\d.]+)"/g)].map((m) => Number(m[1]))
    expect(strokes).toHaveLength(doc.circuit.hoses.length)
    expect(strokes.sort((a, b) => a - b).at(-1)).toBe(31.75) // 1-1/4 in radiator hose (exact 25.4 mm/in)
  })

  it('places each part at its projection in the view', () => {
    for (const view of ['side', 'top'] as const) {
      const svg = documentToSvg(doc, view, theme)
      for (const c of doc.circuit.components) {
        const q = project(view, c.position)
        expect(svg).toContain(`translate(${Number(q.u.toFixed(2))} ${Number(q.v.toFixed(2))})`)
      }
    }
  })

  it('marks the elements of findings in the severity colours', () => {
    const report = analyzeCircuit(doc)
    expect(report.counts.error).toBeGreaterThan(0) // the demo's open third outlet
    const svg = documentToSvg(doc, 'top', theme, { report, flow: 'open' })
    expect(svg).toContain(`stroke="${theme.severity.error}"`)
    expect(svg).toMatch(/L\/min · [\d.]+ m\/s/)
  })
})
