// Figures shaped for a chart: one datum per bar or slice.
import type { Report } from '../engine'
import { MATERIAL_NAMES } from './hoseLines'
import { num } from './format'

export interface ChartDatum {
  label: string
  value: number
  unit: 'L' | 'L/min'
  /** the series a datum belongs to, when a chart has more than one */
  series?: 'thermostat open' | 'thermostat shut'
  /** the engine's branch kind, for colouring */
  kind?: string
  elementIds: string[]
}

/**
 * Coolant volume by part: each part on its own, and the hoses grouped as the shopping list groups
 * them (material and bore). Largest first; parts that hold nothing are left out. The values add up to
 * the report's total.
 */
export function volumeByPart(report: Report): ChartDatum[] {
  const q = report.quantities
  const volumeOf = new Map(q.volume.parts.map((p) => [p.elementId, p.volumeL]))
  const hoseIds = new Set(q.hoses.map((h) => h.hoseId))
  const byTag = new Map(q.hoses.map((h) => [h.tag, h.hoseId]))
  const out: ChartDatum[] = q.volume.parts
    .filter((p) => !hoseIds.has(p.elementId))
    .map((p) => ({ label: p.name, value: p.volumeL, unit: 'L' as const, elementIds: [p.elementId] }))
  for (const t of q.hoseTotals) {
    const ids = t.tags.map((tag) => byTag.get(tag)).filter((id): id is string => id !== undefined)
    out.push({
      label: `${MATERIAL_NAMES[t.material]}, ${num(t.insideDiameterMm)} mm (${t.tags.join(', ')})`,
      value: ids.reduce((s, id) => s + (volumeOf.get(id) ?? 0), 0),
      unit: 'L',
      elementIds: ids,
    })
  }
  return out.filter((d) => d.value > 0).sort((a, b) => b.value - a.value || (a.label < b.label ? -1 : a.label > b.label ? 1 : 0))
}

/**
 * Flow by branch for the thermostat open and shut, L/min, as the engine solved it, in the engine's
 * branch order (downstream from the pump). The pump's own branch carries the whole flow, so it is the
 * total rather than a share and is left out; a state the engine did not solve gives no data.
 */
export function flowSplit(report: Report): ChartDatum[] {
  const out: ChartDatum[] = []
  for (const [state, series] of [['open', 'thermostat open'], ['closed', 'thermostat shut']] as const) {
    const flow = report.flow[state]
    if (!flow.solved) continue
    for (const b of flow.branches) {
      if (b.kind === 'pump') continue
      out.push({ label: b.label, value: b.flowLpm, unit: 'L/min', series, kind: b.kind, elementIds: [...b.componentIds, ...b.hoseIds] })
    }
  }
  return out
}
