// The shopping list as CSV for a spreadsheet, and back: a workshop can price the lines and import them.
import Papa from 'papaparse'
import { SHOP_SECTIONS, type ShopSection, type ShoppingLine, type ShoppingList } from './types'

/**
 * Columns, in this order. Numbers are written with a dot decimal (JavaScript's own number text);
 * element ids are separated by spaces (ids never contain one).
 */
export const CSV_COLUMNS = [
  'id', 'section', 'parentId', 'description', 'quantity', 'unit', 'sizeMetric', 'sizeImperial',
  'quantityMetric', 'quantityImperial', 'source', 'price', 'supplier', 'notes', 'elementIds',
] as const

type CsvRow = Record<(typeof CSV_COLUMNS)[number], string | number>

function rowOf(l: ShoppingLine): CsvRow {
  return {
    id: l.id, section: l.section, parentId: l.parentId ?? '', description: l.description,
    quantity: l.quantity, unit: l.unit, sizeMetric: l.sizes.metric, sizeImperial: l.sizes.imperial,
    quantityMetric: l.quantityText.metric, quantityImperial: l.quantityText.imperial, source: l.source,
    price: l.price ?? '', supplier: l.supplier ?? '', notes: l.notes, elementIds: l.elementIds.join(' '),
  }
}

/**
 * CSV with a header row. Text that a spreadsheet would run as a formula (starting with = + - @, tab
 * or carriage return) is written with a leading apostrophe; `shoppingLinesFromCsv` takes it off again.
 */
export function shoppingListCsv(list: ShoppingList): string {
  return Papa.unparse(
    { fields: [...CSV_COLUMNS], data: list.lines.map((l) => CSV_COLUMNS.map((c) => rowOf(l)[c])) },
    { escapeFormulae: true, newline: '\r\n' },
  )
}

const FORMULA_START = /^'[=+\-@\t\r]/
const unescape = (s: string): string => (FORMULA_START.test(s) ? s.slice(1) : s)

function numberOrNull(text: string, what: string): number | null {
  const t = text.trim()
  if (t === '') return null
  const n = Number(t)
  if (!Number.isFinite(n)) throw new Error(`${what} must be a number with a dot decimal, got "${text}"`)
  return n
}

/** Reads a list written by `shoppingListCsv` (possibly priced in a spreadsheet) back into lines. */
export function shoppingLinesFromCsv(text: string): ShoppingLine[] {
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true })
  if (parsed.errors.length > 0) throw new Error(`CSV row ${parsed.errors[0]!.row ?? '?'}: ${parsed.errors[0]!.message}`)
  const missing = CSV_COLUMNS.filter((c) => !parsed.meta.fields?.includes(c))
  if (missing.length > 0) throw new Error(`CSV is missing the column(s) ${missing.join(', ')}`)
  return parsed.data.map((raw, i) => {
    const r = Object.fromEntries(CSV_COLUMNS.map((c) => [c, unescape(raw[c] ?? '')])) as Record<(typeof CSV_COLUMNS)[number], string>
    const section = r.section as ShopSection
    if (!SHOP_SECTIONS.includes(section)) throw new Error(`row ${i + 1}: unknown section "${r.section}"`)
    if (r.source !== 'engine' && r.source !== 'custom') throw new Error(`row ${i + 1}: source must be engine or custom`)
    const quantity = numberOrNull(r.quantity, `row ${i + 1} quantity`)
    if (quantity === null) throw new Error(`row ${i + 1}: quantity is empty`)
    return {
      id: r.id, section, parentId: r.parentId === '' ? null : r.parentId, description: r.description,
      quantity, unit: r.unit, sizes: { metric: r.sizeMetric, imperial: r.sizeImperial },
      quantityText: { metric: r.quantityMetric, imperial: r.quantityImperial }, source: r.source,
      price: numberOrNull(r.price, `row ${i + 1} price`), supplier: r.supplier === '' ? null : r.supplier,
      notes: r.notes, elementIds: r.elementIds === '' ? [] : r.elementIds.split(' '),
    }
  })
}
