// The shopping list of a version with what the workshop keeps on it: its own lines, prices and
// suppliers, and the bought and fitted ticks. The list itself is shared/shop's, from the frozen
// document and the engine's report; nothing here recomputes a quantity.
import { and, eq } from 'drizzle-orm'
import { shoppingList, type CustomLineInput, type ShopSection, type ShoppingList } from '#shared/shop'
import type { PersonRef } from '#shared/schemas/review'
import type { ShopLineView, ShopTick } from '#shared/schemas/shop'
import type { ShopLineRow } from '../database/schema'
import type { Database } from './db'
import type { ShopVersion } from './shopVersion'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

export const CUSTOM_PREFIX = 'custom/'

export async function shopLineRows(db: Executor, workshopId: string, circuitId: string, version: number): Promise<ShopLineRow[]> {
  const t = schema.shopLines
  return await db.select().from(t)
    .where(and(eq(t.workshopId, workshopId), eq(t.circuitId, circuitId), eq(t.version, version)))
    .orderBy(t.createdAt, t.lineId)
}

/** The rows as the list's options: the workshop's own lines and the prices of the engine's lines. */
function listOptions(rows: readonly ShopLineRow[]) {
  const customLines: CustomLineInput[] = []
  const prices: Record<string, { price: number | null; supplier: string | null }> = {}
  for (const r of rows) {
    if (r.custom) {
      customLines.push({
        id: r.lineId.slice(CUSTOM_PREFIX.length), description: r.custom.description, quantity: r.custom.quantity, unit: r.custom.unit,
        section: r.custom.section as ShopSection, sizes: { metric: r.custom.sizeMetric, imperial: r.custom.sizeImperial },
        price: r.price, supplier: r.supplier, notes: r.custom.notes,
      })
    } else if (r.price !== null || r.supplier !== null) {
      prices[r.lineId] = { price: r.price, supplier: r.supplier }
    }
  }
  return { customLines, prices }
}

/** The version's list (shared/shop) without the workshop's ticks: for the CSV and for checking ids. */
export function listFor(v: ShopVersion, rows: readonly ShopLineRow[]): ShoppingList {
  return shoppingList(v.document, v.report, listOptions(rows))
}

export function listWithTicks(list: ShoppingList, rows: readonly ShopLineRow[], people: Map<string, PersonRef>): Omit<ShoppingList, 'lines'> & { lines: ShopLineView[] } {
  const byId = new Map(rows.map((r) => [r.lineId, r]))
  const tick = (at: Date | null, by: string | null): ShopTick | null => (at ? { at: at.toISOString(), by: by ? people.get(by) ?? null : null } : null)
  return {
    ...list,
    lines: list.lines.map((l) => {
      const r = byId.get(l.id)
      return { ...l, bought: tick(r?.boughtAt ?? null, r?.boughtBy ?? null), fitted: tick(r?.fittedAt ?? null, r?.fittedBy ?? null) }
    }),
  }
}

/** 400 unless the id names a line of this version's list; returns the line. */
export function lineOrFail(list: ShoppingList, lineId: string) {
  const line = list.lines.find((l) => l.id === lineId)
  if (!line) invalidInput([{ path: 'lineId', message: 'Not a line of this shopping list' }])
  return line
}
