// The summary pictures on the PDF, drawn as plain bars with pdfkit: coolant volume by part, and the
// flow through each branch with the thermostat open and shut (shared/shop's chart data).
import type { ChartDatum } from '#shared/shop'
import { num } from '#shared/shop/format'
import { LITRES_PER_US_GALLON, LITRES_PER_US_QUART } from '#shared/physics/units'
import type { ShopView } from '#shared/schemas/shop'
import { SHEET_COLOURS, type SheetWriter } from './buildSheetPdfKit'

const SERIES_COLOURS = { 'thermostat open': SHEET_COLOURS.coolant, 'thermostat shut': SHEET_COLOURS.copper } as const

function bars(w: SheetWriter, items: Array<{ label: string; value: number; text: string; colour: string }>, max: number) {
  const d = w.doc
  const labelWidth = w.width * 0.38
  const barSpace = w.width * 0.34
  for (const it of items) {
    d.font('body').fontSize(8)
    const h = Math.max(11, d.heightOfString(w.t(it.label), { width: labelWidth - 6 })) + 3
    w.ensure(h)
    const y = d.y
    d.fillColor(SHEET_COLOURS.ink).text(w.t(it.label), w.left, y, { width: labelWidth - 6 })
    const len = max > 0 ? Math.max(0.5, (it.value / max) * barSpace) : 0
    d.save().rect(w.left + labelWidth, y + 1, len, 8).fill(it.colour).restore()
    d.font('body').fontSize(8).fillColor(SHEET_COLOURS.ink).text(w.t(it.text), w.left + labelWidth + len + 4, y, { width: w.width - labelWidth - len - 4, lineBreak: false })
    d.x = w.left
    d.y = y + h
  }
}

export function drawCharts(w: SheetWriter, view: ShopView) {
  w.heading('Summary: coolant volume by part', 14, 80)
  const volume = view.charts.volumeByPart
  if (volume.length === 0) w.para('Nothing in the drawing holds coolant yet.')
  else {
    bars(w, volume.map((v) => ({ label: v.label, value: v.value, colour: SHEET_COLOURS.coolant, text: `${num(v.value)} L (${num(v.value / LITRES_PER_US_QUART)} US qt)` })), Math.max(...volume.map((v) => v.value)))
  }
  w.heading('Summary: flow by branch, thermostat open and shut', 14, 80)
  const flow = view.charts.flowSplit
  if (flow.length === 0) {
    w.para('The flow was not solved for this drawing, so there is no split to show.')
    return
  }
  w.para('Bars: dark teal = thermostat open, copper = thermostat shut. L/min and US gal/min as the engine solved them.', { size: 8, colour: SHEET_COLOURS.soft })
  const labels = [...new Set(flow.map((f) => f.label))]
  const max = Math.max(...flow.map((f) => Math.abs(f.value)))
  const items = labels.flatMap((label) => flow.filter((f): f is ChartDatum & { series: keyof typeof SERIES_COLOURS } => f.label === label && f.series !== undefined).map((f) => ({
    label: `${label} (${f.series === 'thermostat open' ? 'open' : 'shut'})`,
    value: Math.abs(f.value),
    colour: SERIES_COLOURS[f.series],
    text: `${num(f.value, 1)} L/min (${num(f.value / LITRES_PER_US_GALLON, 2)} US gal/min)`,
  })))
  bars(w, items, max)
}
