// A view of a circuit as a stand-alone SVG drawing: the same projection and symbols as the editor's
// canvas, simplified (no hover, no handles), with a scale bar, the view's axes and, on request, the
// findings' marks and the flow arrows of one thermostat state. Pure: document in, text out.
import type { CircuitDocument } from '../circuit/document'
import type { Report, Severity } from '../engine/report'
import { flowMarks } from './flow'
import { gridSteps, gridValues, scaleBar } from './grid'
import { portMarker } from './portMarkers'
import { VIEWS, type ViewName } from './projection'
import { ViewScene } from './scene'
import { outlineStub, symbolPrimitives, type Fill, type Primitive } from './symbols'
import { hoseStrokePx, type DrawingTheme } from './theme'

export interface SvgOptions {
  report?: Report | null
  flow?: 'off' | 'open' | 'closed'
  /** width of the picture in px (the height follows the drawing) */
  widthPx?: number
}

export const escapeXml = (s: string) =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;')

const n = (v: number) => Number(v.toFixed(2)).toString()

function fillOf(f: Fill, t: DrawingTheme): string {
  return f === 'body' ? t.body : f === 'accent' ? t.accent : f === 'ink' ? t.stroke : 'none'
}

function primitiveSvg(p: Primitive, t: DrawingTheme, strokePx: number): string {
  const stroke = `stroke="${t.stroke}" stroke-width="${n(strokePx)}" fill="${fillOf(p.fill, t)}"`
  if (p.kind === 'rect') return `<rect x="${n(p.x)}" y="${n(p.y)}" width="${n(p.w)}" height="${n(p.h)}" rx="${n(p.r ?? 0)}" ${stroke}/>`
  if (p.kind === 'circle') return `<circle cx="${n(p.cx)}" cy="${n(p.cy)}" r="${n(p.r)}" ${stroke}/>`
  const pts = []
  for (let i = 0; i < p.points.length; i += 2) pts.push(`${n(p.points[i]!)},${n(p.points[i + 1]!)}`)
  const dash = p.dash ? ` stroke-dasharray="${n(strokePx * 4)} ${n(strokePx * 3)}"` : ''
  return `<${p.closed ? 'polygon' : 'polyline'} points="${pts.join(' ')}" ${stroke}${dash} stroke-linejoin="round"/>`
}

function severityOf(report: Report | null | undefined): Map<string, Severity> {
  const rank: Record<Severity, number> = { error: 0, warning: 1, note: 2 }
  const out = new Map<string, Severity>()
  for (const f of report?.findings ?? []) {
    for (const id of f.elementIds) {
      const was = out.get(id)
      if (!was || rank[f.severity] < rank[was]) out.set(id, f.severity)
    }
  }
  return out
}

/** The view as SVG text. */
export function documentToSvg(doc: CircuitDocument, view: ViewName, theme: DrawingTheme, options: SvgOptions = {}): string {
  const scene = new ViewScene(view)
  scene.update(doc)
  const b = scene.bounds() ?? { minU: -500, minV: -500, maxU: 500, maxV: 500 }
  const margin = Math.max(100, 0.08 * Math.max(b.maxU - b.minU, b.maxV - b.minV))
  const minU = b.minU - margin
  const minV = b.minV - margin
  const w = b.maxU - b.minU + 2 * margin
  const h = b.maxV - b.minV + 2 * margin + margin // room below for the scale bar and title
  const widthPx = options.widthPx ?? 1600
  const scale = Math.min(widthPx / w, 1400 / h)
  const px = 1 / scale
  const out: string[] = []
  const info = VIEWS[view]
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(minU)} ${n(minV)} ${n(w)} ${n(h)}" width="${Math.round(w * scale)}" height="${Math.round(h * scale)}" font-family="Atkinson Hyperlegible, sans-serif">`)
  out.push(`<title>${escapeXml(`${doc.circuit.title} — ${info.title}`)}</title>`)
  out.push(`<rect x="${n(minU)}" y="${n(minV)}" width="${n(w)}" height="${n(h)}" fill="${theme.background}"/>`)

  const grid = gridSteps(scale, 14).major
  out.push(`<g stroke="${theme.gridMajor}" stroke-width="${n(px * 0.6)}">`)
  for (const u of gridValues(minU, minU + w, grid, 400)) out.push(`<line x1="${n(u)}" y1="${n(minV)}" x2="${n(u)}" y2="${n(minV + h)}"/>`)
  for (const v of gridValues(minV, minV + h, grid, 400)) out.push(`<line x1="${n(minU)}" y1="${n(v)}" x2="${n(minU + w)}" y2="${n(v)}"/>`)
  out.push('</g>')

  const marks = severityOf(options.report)
  // big parts first so small ones on them stay visible; hoses over the bodies, ports and labels on top
  const parts = [...scene.parts.values()].sort((a, b) => b.outline.w * b.outline.h - a.outline.w * a.outline.h)
  for (const part of parts) {
    const sev = marks.get(part.id)
    const o = part.outline
    if (sev) out.push(`<rect x="${n(part.u - o.w / 2 - 6 * px)}" y="${n(part.v - o.h / 2 - 6 * px)}" width="${n(o.w + 12 * px)}" height="${n(o.h + 12 * px)}" fill="none" stroke="${theme.severity[sev]}" stroke-width="${n(3 * px)}" transform="rotate(${n(o.rotation)} ${n(part.u)} ${n(part.v)})"/>`)
    out.push(`<g transform="translate(${n(part.u)} ${n(part.v)}) rotate(${n(o.rotation)})">`)
    for (const prim of symbolPrimitives(part.comp.type, o.w, o.h)) out.push(primitiveSvg(prim, theme, 1.2 * px))
    out.push('</g>')
  }
  for (const hg of scene.hoses.values()) {
    const style = theme.materials[hg.hose.material]
    const pts = []
    for (let i = 0; i < hg.flat.length; i += 2) pts.push(`${n(hg.flat[i]!)},${n(hg.flat[i + 1]!)}`)
    const width = hoseStrokePx(hg.hose.insideDiameterMm, scale) * px
    const sev = marks.get(hg.id)
    if (sev) out.push(`<polyline points="${pts.join(' ')}" fill="none" stroke="${theme.severity[sev]}" stroke-opacity="0.35" stroke-width="${n(width + 8 * px)}" stroke-linejoin="round"/>`)
    out.push(`<polyline points="${pts.join(' ')}" fill="none" stroke="${style.colour}" stroke-opacity="0.6" stroke-width="${n(width)}" stroke-linejoin="round" stroke-linecap="round"><title>${escapeXml(hg.hose.params.label ?? hg.id)}</title></polyline>`)
    if (style.centreDash.length) out.push(`<polyline points="${pts.join(' ')}" fill="none" stroke="${theme.background}" stroke-width="${n(px)}" stroke-dasharray="${style.centreDash.map((d) => n(d * px)).join(' ')}"/>`)
    if (hg.crosses || hg.tooShort) out.push(`<polyline points="${pts.join(' ')}" fill="none" stroke="${theme.severity.error}" stroke-width="${n(2 * px)}" stroke-dasharray="${n(8 * px)} ${n(5 * px)}"/>`)
  }
  for (const part of parts) {
    const o = part.outline
    for (const p of part.ports) {
      const stub = outlineStub(part, o, p)
      if (stub) out.push(`<line x1="${n(stub[0])}" y1="${n(stub[1])}" x2="${n(stub[2])}" y2="${n(stub[3])}" stroke="${theme.stroke}" stroke-width="${n(px * 1.2)}"/>`)
      const psev = marks.get(p.id)
      if (psev) out.push(`<circle cx="${n(p.u)}" cy="${n(p.v)}" r="${n(10 * px)}" fill="none" stroke="${theme.severity[psev]}" stroke-width="${n(2.5 * px)}"/>`)
      out.push(`<g transform="translate(${n(p.u)} ${n(p.v)}) scale(${n(px)})">`)
      for (const prim of portMarker(p.port.role, p.outward, 9, p.port.blocked)) out.push(primitiveSvg(prim, theme, 1.2))
      out.push('</g>')
    }
    out.push(`<text x="${n(part.u)}" y="${n(part.v + o.h / 2 + 14 * px)}" font-size="${n(11 * px)}" text-anchor="middle" fill="${theme.stroke}">${escapeXml(part.comp.label)}</text>`)
  }

  const state = options.flow && options.flow !== 'off' ? options.report?.flow[options.flow] : undefined
  if (state) {
    for (const m of flowMarks(scene, state)) {
      if (!m.moving) continue
      const a = (m.angle * 180) / Math.PI
      out.push(`<g transform="translate(${n(m.u)} ${n(m.v)}) rotate(${n(a)}) scale(${n(px)})"><polygon points="-7,-6 8,0 -7,6" fill="${theme.colours.ink.DEFAULT}"/></g>`)
      out.push(`<text x="${n(m.u)}" y="${n(m.v - 10 * px)}" font-size="${n(10 * px)}" text-anchor="middle" fill="${theme.colours.ink.soft}">${escapeXml(m.label)}</text>`)
    }
  }

  const bar = scaleBar(scale, 160)
  const bx = minU + 20 * px
  const by = minV + h - 24 * px
  out.push(`<g stroke="${theme.stroke}" stroke-width="${n(2 * px)}"><line x1="${n(bx)}" y1="${n(by)}" x2="${n(bx + bar.lengthMm)}" y2="${n(by)}"/>`)
  out.push(`<line x1="${n(bx)}" y1="${n(by - 5 * px)}" x2="${n(bx)}" y2="${n(by + 5 * px)}"/><line x1="${n(bx + bar.lengthMm)}" y1="${n(by - 5 * px)}" x2="${n(bx + bar.lengthMm)}" y2="${n(by + 5 * px)}"/></g>`)
  out.push(`<text x="${n(bx)}" y="${n(by - 8 * px)}" font-size="${n(11 * px)}" fill="${theme.stroke}">${escapeXml(bar.label)}</text>`)
  out.push(`<text x="${n(bx + bar.lengthMm + 16 * px)}" y="${n(by + 4 * px)}" font-size="${n(11 * px)}" fill="${theme.colours.ink.soft}">${escapeXml(`${info.title} · ${info.horizontalLabel} → · ${info.verticalLabel} ↑ · ${doc.circuit.title}`)}</text>`)
  out.push('</svg>')
  return out.join('\n')
}
