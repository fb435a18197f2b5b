// Hose and clamp lines, taken from the engine's quantities as they stand: lengths, grouping, the
// "sold by" rounding and the clamp choice are the engine's; here they are only written out.
import type { HoseMaterial } from '../circuit'
import { WORM_DRIVE_CLAMP_SIZES, type ClampLine, type CountLine, type HoseLine, type Report } from '../engine'
import { boreSizes, capitalise, pieces, cutLengthInches, inchText, metresText, mmText, num, rangeSizes, slug } from './format'
import { fuelHoseClass } from './fuelLines'
import type { DualText, ShoppingLine } from './types'

export const MATERIAL_NAMES: Record<HoseMaterial, string> = {
  'j20-r3-heater': 'heater hose (SAE J20 R3)',
  'j20-r4-radiator': 'radiator hose (SAE J20 R4)',
  silicone: 'silicone coolant hose',
  'j30-r6': 'fuel hose (SAE J30 R6)',
  'j30-r7': 'fuel hose (SAE J30 R7)',
  'j30-r9': 'fuel-injection hose (SAE J30 R9)',
  'j30-r14': 'low-permeation fuel hose (SAE J30 R14)',
  'j30-r10': 'submersible in-tank fuel hose (SAE J30 R10)',
  'ptfe-lined': 'PTFE-lined braided fuel hose',
  'hard-line': 'hard line (tube)',
}

/** Key of a hose group, the same grouping as the engine's totals (material and bore to 0.01 mm). */
export const hoseGroupId = (material: HoseMaterial, boreMm: number): string => `hose/${material}/${boreMm.toFixed(2)}`

function line(fields: Omit<ShoppingLine, 'source' | 'price' | 'supplier'>): ShoppingLine {
  return { ...fields, source: 'engine', price: null, supplier: null }
}

function clampText(c: ClampLine | undefined): string {
  if (!c) return 'no clamp'
  if (c.kind === 'none') return 'no clamp'
  return `${CLAMP_ITEM_WORDS[`${c.kind} clamp`] ?? `${c.kind} clamp`} ${c.size ?? `(no listed size for ${num(c.assembledOdMm)} mm OD)`}`
}

function cutLine(h: HoseLine, parentId: string, clamps: ClampLine[], allowance: string): ShoppingLine {
  const clampAt = (end: 'from' | 'to') => clamps.find((c) => c.hoseId === h.hoseId && c.end === end)
  const base = h.measuredLengthMm !== null ? `measured ${num(h.measuredLengthMm, 0)} mm` : `drawn ${num(h.drawnLengthMm, 0)} mm`
  return line({
    id: `cut/${h.hoseId}`,
    section: 'hoses',
    parentId,
    description: `${h.tag}${h.label ? ` ${h.label}` : ''}: ${h.fromText} to ${h.toText}`,
    quantity: 1,
    unit: 'piece',
    sizes: { metric: `cut ${num(h.cutLengthMm, 0)} mm`, imperial: `cut ${cutLengthInches(h.cutLengthMm)}` },
    quantityText: pieces(1),
    notes: `${base} ${allowance}; from end: ${clampText(clampAt('from'))}; to end: ${clampText(clampAt('to'))}`,
    elementIds: [h.hoseId],
  })
}

/** One line per hose group to buy, each followed by its cut pieces H1, H2 … with both ends named. */
export function hoseSection(report: Report, allowance: { percent: number; perEndMm: number }): ShoppingLine[] {
  const q = report.quantities
  const byTag = new Map(q.hoses.map((h) => [h.tag, h]))
  const allowanceText = `+ ${num(allowance.percent)} % + 2 × ${num(allowance.perEndMm)} mm, rounded up to the mm`
  const out: ShoppingLine[] = []
  for (const t of q.hoseTotals) {
    const id = hoseGroupId(t.material, t.insideDiameterMm)
    const cuts = t.tags.map((tag) => byTag.get(tag)).filter((h): h is HoseLine => h !== undefined)
    const qty: DualText = t.buy.unit === 'm' ? metresText(t.buy.quantity) : pieces(t.buy.quantity)
    // a fuel hose is bought by its pressure class as well as its bore
    const fuelClass = fuelHoseClass(report, t.material)
    const bore = boreSizes(t.insideDiameterMm)
    out.push(line({
      id,
      section: 'hoses',
      parentId: null,
      description: `${capitalise(MATERIAL_NAMES[t.material])}, ${mmText(t.insideDiameterMm)} bore${fuelClass ? `, ${fuelClass.words}` : ''}`,
      quantity: t.buy.quantity,
      unit: t.buy.unit,
      sizes: fuelClass ? { metric: `${bore.metric}, ${fuelClass.sizes.metric}`, imperial: `${bore.imperial}, ${fuelClass.sizes.imperial}` } : bore,
      quantityText: qty,
      notes: `${t.rule}. Cut ${t.tags.join(', ')}: ${num(t.cutTotalMm, 0)} mm in all.`,
      elementIds: cuts.map((h) => h.hoseId),
    }))
    for (const h of cuts) out.push(cutLine(h, id, q.clamps, allowanceText))
  }
  return out
}

/** "SAE 24 (27–51 mm)": the size number the engine chose, read back to find its range in the same table. */
function wormDriveRange(sizeText: string): { size: number; minMm: number; maxMm: number } | null {
  const m = /^SAE (\d+)\b/.exec(sizeText)
  if (!m) return null
  return WORM_DRIVE_CLAMP_SIZES.find((s) => s.size === Number(m[1])) ?? null
}

/** Sizes in a text the engine wrote, "for 42 mm OD", "32 mm → 16 mm" → [42], [32, 16]. */
export function mmFigures(text: string): number[] {
  return [...text.matchAll(/(\d+(?:\.\d+)?) mm/g)].map((m) => Number(m[1]))
}

function clampSizes(c: CountLine): DualText {
  const range = wormDriveRange(c.size)
  if (range) return { ...rangeSizes(range.minMm, range.maxMm), metric: `SAE ${range.size}, ${rangeSizes(range.minMm, range.maxMm).metric}` }
  const od = mmFigures(c.size)[0]
  return od !== undefined ? { metric: c.size, imperial: c.size.replace(/\d+(?:\.\d+)? mm/, inchText(od)) } : { metric: c.size, imperial: c.size }
}

/** Clamp items whose code reads badly on a list. */
const CLAMP_ITEM_WORDS: Record<string, string> = { 'efi-band clamp': 'fuel-injection clamp (smooth band)' }

export function clampSection(report: Report): ShoppingLine[] {
  const tagOf = new Map(report.quantities.hoses.map((h) => [h.hoseId, h.tag]))
  return report.quantities.clampCounts.map((c) => {
    const perHose = new Map<string, number>()
    for (const id of c.elementIds) perHose.set(id, (perHose.get(id) ?? 0) + 1)
    const where = [...perHose].map(([id, n]) => `${tagOf.get(id) ?? id}${n > 1 ? ` ×${n}` : ''}`).join(', ')
    const range = wormDriveRange(c.size)
    return line({
      id: `clamp/${slug(c.item)}/${slug(range ? `sae-${range.size}` : c.size)}`,
      section: 'clamps',
      parentId: null,
      description: `${capitalise(CLAMP_ITEM_WORDS[c.item] ?? c.item)}${range ? ` SAE ${range.size}` : ` ${c.size}`}`,
      quantity: c.count,
      unit: 'piece',
      sizes: clampSizes(c),
      quantityText: pieces(c.count),
      notes: `On ${where}. Sized on the assembled hose OD over the spigot.`,
      elementIds: [...perHose.keys()],
    })
  })
}
