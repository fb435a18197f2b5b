// Clamps, fittings, plugs and the other small parts for the shopping list.
import type { AnalysisContext } from '../context'
import { portName, size, type CompInfo } from '../model'
import { wormDriveClampFor } from '../sizes'
import type { ClampLine, CountLine, Quantities } from './types'

const wormDriveTexts = new Map<object, string>()
/** "SAE 24 (27–51 mm)", one text per table row */
function wormDriveText(assembledOdMm: number): string | null {
  const s = wormDriveClampFor(assembledOdMm)
  if (!s) return null
  let text = wormDriveTexts.get(s)
  if (text === undefined) { text = `SAE ${s.size} (${s.minMm}–${s.maxMm} mm)`; wormDriveTexts.set(s, text) }
  return text
}

export function clampLines(ctx: AnalysisContext): ClampLine[] {
  const lines: ClampLine[] = []
  for (const h of ctx.model.hoses) {
    for (let e = 0; e < 2; e++) {
      const end = e === 0 ? h.from : h.to
      const kind = h.hose[end.name].clamp
      if (kind === 'none') continue
      // The hose takes the spigot's size where it is pushed on, so the clamp closes on spigot OD + 2 walls.
      const base = end.port ? end.port.port.spigotOdMm : h.hose.insideDiameterMm
      const od = base + 2 * h.hose.wallMm
      const clampSize = kind === 'worm-drive' ? wormDriveText(od) : `for ${size(od)} mm OD`
      lines.push({ hoseId: h.hose.id, tag: h.tag, end: end.name, kind, assembledOdMm: od, size: clampSize })
    }
  }
  return lines
}

/**
 * Natural order: text by character code, numbers (digits with an optional decimal part) by value, so
 * that "SAE 6" comes before "SAE 12"; a number equal in value but written differently ("8", "08")
 * by its text; a text part that runs out first sorts first. The same order as splitting both texts
 * into text and number parts and comparing part by part, found without splitting: the texts agree up
 * to their first difference, and only the parts at that point decide. The same on every machine.
 * `knownEqual`: the texts are known to agree in that many first characters.
 */
export function naturalCompare(a: string, b: string, knownEqual = 0): number {
  const n = Math.min(a.length, b.length)
  let i = knownEqual
  while (i < n && a.charCodeAt(i) === b.charCodeAt(i)) i++
  if (i === a.length && i === b.length) return 0
  // the start of the number the difference falls in, if it falls in one
  let s = i
  while (s > 0 && (isDigit(a, s - 1) || (a.charCodeAt(s - 1) === 46 && s > 1 && isDigit(a, s - 2) && (isDigit(a, s) || isDigit(b, s))))) s--
  const inNumber = s < i || ((i < a.length && isDigit(a, i)) && (i < b.length && isDigit(b, i)))
  if (inNumber && s < a.length && s < b.length && isDigit(a, s) && isDigit(b, s)) {
    const ea = numberEnd(a, s)
    const eb = numberEnd(b, s)
    const byValue = compareNumbers(a, s, ea, b, s, eb)
    if (byValue !== 0) return byValue
    // equal in value: as written ("08" before "8"), and if written the same, what follows decides
    for (let p = s, q = s; p < ea || q < eb; p++, q++) {
      if (p >= ea) return -1
      if (q >= eb) return 1
      const d = a.charCodeAt(p) - b.charCodeAt(q)
      if (d !== 0) return d
    }
    return naturalCompare(a.slice(ea), b.slice(eb))
  }
  // a text part ends where the other goes on: at the end of the text, or where a number starts
  const endA = i >= a.length || isDigit(a, i)
  const endB = i >= b.length || isDigit(b, i)
  if (endA !== endB) return endA ? -1 : 1
  if (endA) return i >= a.length ? (i >= b.length ? 0 : -1) : 1
  return a.charCodeAt(i) - b.charCodeAt(i)
}

/** How many first characters all the lines' sizes have in common. */
function sharedStart(lines: CountLine[]): number {
  if (lines.length < 2) return 0
  const first = lines[0]!.size
  let shared = first.length
  for (let k = 1; k < lines.length && shared > 0; k++) {
    const t = lines[k]!.size
    const n = Math.min(shared, t.length)
    let i = 0
    while (i < n && t.charCodeAt(i) === first.charCodeAt(i)) i++
    shared = i
  }
  return shared
}

function isDigit(s: string, i: number): boolean {
  const c = s.charCodeAt(i)
  return c >= 48 && c <= 57
}

/**
 * Two numbers by value, from their digits (no parsing): the integer parts by length without leading
 * zeros, then digit by digit, then the decimals digit by digit (a missing digit counts as 0).
 */
function compareNumbers(a: string, sa: number, ea: number, b: string, sb: number, eb: number): number {
  while (sa < ea - 1 && a.charCodeAt(sa) === 48 && isDigit(a, sa + 1)) sa++
  while (sb < eb - 1 && b.charCodeAt(sb) === 48 && isDigit(b, sb + 1)) sb++
  let ia = sa
  while (ia < ea && isDigit(a, ia)) ia++
  let ib = sb
  while (ib < eb && isDigit(b, ib)) ib++
  if (ia - sa !== ib - sb) return ia - sa - (ib - sb)
  for (let p = sa, q = sb; p < ia; p++, q++) {
    const d = a.charCodeAt(p) - b.charCodeAt(q)
    if (d !== 0) return d
  }
  // decimals: past the point, if any
  let p = ia < ea ? ia + 1 : ea
  let q = ib < eb ? ib + 1 : eb
  while (p < ea || q < eb) {
    const da = p < ea ? a.charCodeAt(p) : 48
    const db = q < eb ? b.charCodeAt(q) : 48
    if (da !== db) return da - db
    p++
    q++
  }
  return 0
}

/** End of the number that starts at i: digits, and a decimal point with digits after it. */
function numberEnd(s: string, i: number): number {
  let k = i
  while (k < s.length && isDigit(s, k)) k++
  if (k + 1 < s.length && s.charCodeAt(k) === 46 && isDigit(s, k + 1)) {
    k++
    while (k < s.length && isDigit(s, k)) k++
  }
  return k
}

/** Counted lines of each kind of item, keyed by their size text. */
type ItemGroups = Map<string, Map<string, CountLine>>

function count(groups: ItemGroups, item: string, sizeText: string, id: string): void {
  let sizes = groups.get(item)
  if (!sizes) { sizes = new Map(); groups.set(item, sizes) }
  const line = sizes.get(sizeText)
  if (line) { line.count++; line.elementIds.push(id) } else sizes.set(sizeText, { item, size: sizeText, count: 1, elementIds: [id] })
}

/** The lines in natural order of item, then size. */
function countedLines(groups: ItemGroups): CountLine[] {
  const out: CountLine[] = []
  for (const item of [...groups.keys()].sort((x, y) => naturalCompare(x, y))) {
    const lines = [...groups.get(item)!.values()]
    // lines of one item mostly start alike ("for 8 mm spigot (…"): the comparisons skip what all share
    const shared = sharedStart(lines)
    lines.sort((x, y) => naturalCompare(x.size, y.size, shared))
    for (const line of lines) out.push(line)
  }
  return out
}

export function clampCounts(lines: ClampLine[]): CountLine[] {
  const groups: ItemGroups = new Map()
  const items = new Map<string, string>()
  for (const l of lines) {
    let item = items.get(l.kind)
    if (item === undefined) { item = `${l.kind} clamp`; items.set(l.kind, item) }
    count(groups, item, l.size ?? `no listed size for ${size(l.assembledOdMm)} mm OD`, l.hoseId)
  }
  return countedLines(groups)
}

/**
 * "32 mm → 32 mm → 16 mm": a part's spigot sizes, largest first. A drawing has a handful of different
 * fittings, so the texts are kept per set of sizes and one text object serves every part that has it
 * (which also makes grouping by it cheap).
 */
function sizesText(c: CompInfo, known: Array<{ ods: number[]; text: string }>): string {
  const ods = c.ports.map((p) => p.port.spigotOdMm)
  if (ods.length > 1) ods.sort((a, b) => b - a)
  for (const k of known) if (sameNumbers(k.ods, ods)) return k.text
  let text = ''
  for (let i = 0; i < ods.length; i++) text += `${i > 0 ? ' → ' : ''}${size(ods[i]!)} mm`
  if (known.length < 64) known.push({ ods, text })
  return text
}

function sameNumbers(a: number[], b: number[]): boolean {
  if (a.length !== b.length) return false
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false
  return true
}

const FITTING_ITEMS: Partial<Record<string, string>> = {
  tee: 'tee', 'bleed-valve': 'bleed valve', 'blanking-plug': 'blanking plug', drain: 'drain tap', 'heater-valve': 'heater valve',
  'bulkhead-fitting': 'bulkhead fitting',
}

/**
 * What closes a blocked port: a bleed screw, filler cap, drain plug or blanking cap. A fuel tank's vent
 * takes a vent valve, a regulator's spare port a port plug; an injector's seat is its O-ring in the
 * rail, so nothing is bought for it.
 */
function blockedPortItem(type: string, role: string): string | null {
  if (type === 'injector') return null
  if (type === 'fuel-tank' && role === 'vent') return 'vent valve'
  if (type === 'fuel-regulator') return 'port plug'
  return role === 'vent' ? 'bleed screw' : role === 'fill' ? 'filler cap' : role === 'drain' ? 'drain plug' : 'blanking cap'
}

export function fittingCounts(ctx: AnalysisContext): CountLine[] {
  const groups: ItemGroups = new Map()
  const known: Array<{ ods: number[]; text: string }> = []
  for (const c of ctx.model.components) {
    const type = c.comp.type
    if (type === 'reducer') {
      // one line per size step, largest first
      const steps = [...new Set(c.ports.map((p) => p.port.spigotOdMm.toFixed(2)))].map(Number).sort((a, b) => b - a)
      for (let i = 1; i < steps.length; i++) count(groups, 'reducer', `${size(steps[i - 1]!)} mm → ${size(steps[i]!)} mm`, c.comp.id)
    } else {
      const item = FITTING_ITEMS[type]
      if (item) count(groups, item, sizesText(c, known), c.comp.id)
    }
    for (const p of c.ports) {
      if (!p.port.blocked) continue
      const item = blockedPortItem(type, p.port.role)
      if (item === null) continue
      if (item === 'filler cap' && (type === 'pressure-cap' || type === 'expansion-tank')) continue // the pressure cap itself
      count(groups, item, `for ${size(p.port.spigotOdMm)} mm spigot (${portName(p)})`, p.port.id)
    }
  }
  return countedLines(groups)
}

export function thermostatLines(ctx: AnalysisContext): Quantities['thermostats'] {
  const out: Quantities['thermostats'] = []
  for (const c of ctx.model.components) {
    if (c.comp.type !== 'thermostat') continue
    const t = c.comp.params
    out.push({ componentId: c.comp.id, label: c.comp.label, openingTempC: t.openingTempC, fullOpenTempC: t.fullOpenTempC, hasBypass: t.hasBypass === true })
  }
  return out
}

export function capLines(ctx: AnalysisContext): Quantities['caps'] {
  const out: Quantities['caps'] = []
  for (const c of ctx.model.components) {
    if (c.comp.type === 'pressure-cap') out.push({ componentId: c.comp.id, label: c.comp.label, ratingKpa: c.comp.params.ratingKpa })
    else if (c.comp.type === 'expansion-tank' && c.comp.params.capRatingKpa !== undefined) {
      out.push({ componentId: c.comp.id, label: c.comp.label, ratingKpa: c.comp.params.capRatingKpa })
    }
  }
  return out
}
