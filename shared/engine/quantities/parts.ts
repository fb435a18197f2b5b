// Clamps, fittings, plugs and the other small parts for the shopping list.
import type { AnalysisContext } from '../context'
import { portName, size } from '../model'
import { wormDriveClampFor } from '../sizes'
import type { ClampLine, CountLine } from './types'

export function clampLines(ctx: AnalysisContext): ClampLine[] {
  const lines: ClampLine[] = []
  for (const h of ctx.model.hoses) {
    for (const end of [h.from, h.to]) {
      const kind = h.hose[end.name].clamp
      if (kind === 'none') continue
      // The hose takes the spigot's size where it is pushed on, so the clamp closes on spigot OD + 2 walls.
      const base = end.port ? end.port.port.spigotOdMm : h.hose.insideDiameterMm
      const od = base + 2 * h.hose.wallMm
      let clampSize: string | null
      if (kind === 'worm-drive') {
        const s = wormDriveClampFor(od)
        clampSize = s ? `SAE ${s.size} (${s.minMm}–${s.maxMm} mm)` : null
      } else clampSize = `for ${size(od)} mm OD`
      lines.push({ hoseId: h.hose.id, tag: h.tag, end: end.name, kind, assembledOdMm: od, size: clampSize })
    }
  }
  return lines
}

/** Text split into words and numbers, so numbers sort as numbers ("SAE 6" before "SAE 12"), the same on every machine. */
const naturalKey = (text: string): string[] => text.split(/(\d+(?:\.\d+)?)/)

function compareKeys(pa: string[], pb: string[]): number {
  for (let i = 0; i < Math.min(pa.length, pb.length); i++) {
    const x = pa[i]!, y = pb[i]!
    if (x === y) continue
    if (i % 2 === 1) return Number(x) - Number(y) || (x < y ? -1 : 1)
    return x < y ? -1 : 1
  }
  return pa.length - pb.length
}

function countBy(entries: Array<{ item: string; size: string; id: string }>): CountLine[] {
  const map = new Map<string, CountLine>()
  for (const e of entries) {
    const key = `${e.item}|${e.size}`
    const line = map.get(key)
    if (line) { line.count++; line.elementIds.push(e.id) } else map.set(key, { item: e.item, size: e.size, count: 1, elementIds: [e.id] })
  }
  const keyed = [...map.values()].map((line) => ({ line, item: naturalKey(line.item), size: naturalKey(line.size) }))
  keyed.sort((a, b) => compareKeys(a.item, b.item) || compareKeys(a.size, b.size))
  return keyed.map((k) => k.line)
}

export function clampCounts(lines: ClampLine[]): CountLine[] {
  return countBy(lines.map((l) => ({ item: `${l.kind} clamp`, size: l.size ?? `no listed size for ${size(l.assembledOdMm)} mm OD`, id: l.hoseId })))
}

const sizesOf = (ods: number[]) => [...ods].sort((a, b) => b - a).map((d) => `${size(d)} mm`).join(' → ')

export function fittingCounts(ctx: AnalysisContext): CountLine[] {
  const entries: Array<{ item: string; size: string; id: string }> = []
  for (const c of ctx.model.components) {
    const ods = c.ports.map((p) => p.port.spigotOdMm)
    switch (c.comp.type) {
      case 'reducer': {
        // one line per size step, largest first
        const steps = [...new Set(ods.map((d) => d.toFixed(2)))].map(Number).sort((a, b) => b - a)
        for (let i = 1; i < steps.length; i++) entries.push({ item: 'reducer', size: sizesOf([steps[i - 1]!, steps[i]!]), id: c.comp.id })
        break
      }
      case 'tee': entries.push({ item: 'tee', size: sizesOf(ods), id: c.comp.id }); break
      case 'bleed-valve': entries.push({ item: 'bleed valve', size: sizesOf(ods), id: c.comp.id }); break
      case 'blanking-plug': entries.push({ item: 'blanking plug', size: sizesOf(ods), id: c.comp.id }); break
      case 'drain': entries.push({ item: 'drain tap', size: sizesOf(ods), id: c.comp.id }); break
      case 'heater-valve': entries.push({ item: 'heater valve', size: sizesOf(ods), id: c.comp.id }); break
      default: break
    }
    for (const p of c.ports) {
      if (!p.port.blocked) continue
      const item = p.port.role === 'vent' ? 'bleed screw' : p.port.role === 'fill' ? 'filler cap' : p.port.role === 'drain' ? 'drain plug' : 'blanking cap'
      if (item === 'filler cap' && (c.comp.type === 'pressure-cap' || c.comp.type === 'expansion-tank')) continue // the pressure cap itself
      entries.push({ item, size: `for ${size(p.port.spigotOdMm)} mm spigot (${portName(p)})`, id: p.port.id })
    }
  }
  return countBy(entries)
}

export function thermostatLines(ctx: AnalysisContext) {
  return ctx.model.components.flatMap((c) =>
    c.comp.type === 'thermostat'
      ? [{ componentId: c.comp.id, label: c.comp.label, openingTempC: c.comp.params.openingTempC, fullOpenTempC: c.comp.params.fullOpenTempC, hasBypass: c.comp.params.hasBypass === true }]
      : [],
  )
}

export function capLines(ctx: AnalysisContext) {
  return ctx.model.components.flatMap((c) =>
    c.comp.type === 'pressure-cap'
      ? [{ componentId: c.comp.id, label: c.comp.label, ratingKpa: c.comp.params.ratingKpa }]
      : c.comp.type === 'expansion-tank' && c.comp.params.capRatingKpa !== undefined
        ? [{ componentId: c.comp.id, label: c.comp.label, ratingKpa: c.comp.params.capRatingKpa }]
        : [],
  )
}
