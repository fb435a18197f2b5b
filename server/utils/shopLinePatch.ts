// Changing one line of a version's shopping list: price and supplier, the bought (cut) and fitted
// ticks, and the wording of a line the workshop added. One row per line, written with an upsert;
// the row is locked first so two people ticking at once are logged once each, in order.
import { and, eq } from 'drizzle-orm'
import { CUSTOM_ONLY_FIELDS, type ShopActivityAction, type ShopLinePatchInput } from '#shared/schemas/shop'
import type { ShopLineRow, StoredCustomLine } from '../database/schema'
import type { MemberContext } from './auth'
import type { ShopVersion } from './shopVersion'

interface Change { action: ShopActivityAction; details: Record<string, unknown> }

export async function patchShopLine(member: MemberContext, circuitId: string, version: number, input: ShopLinePatchInput) {
  return await useDb().transaction(async (tx) => {
    const v: ShopVersion = await loadShopVersion(tx, member.workshopId, circuitId, version)
    const t = schema.shopLines
    const key = and(eq(t.workshopId, member.workshopId), eq(t.circuitId, circuitId), eq(t.version, version), eq(t.lineId, input.lineId))
    const [existing] = await tx.select().from(t).where(key).for('update')
    const rows = await shopLineRows(tx, member.workshopId, circuitId, version)
    const line = lineOrFail(listFor(v, rows), input.lineId)
    const reworded = CUSTOM_ONLY_FIELDS.filter((f) => input[f] !== undefined)
    if (reworded.length > 0 && line.source !== 'custom') {
      invalidInput(reworded.map((f) => ({ path: f, message: 'Only lines the workshop added can be reworded; the engine\'s lines follow the drawing' })))
    }
    if ((input.price !== undefined || input.supplier !== undefined) && line.parentId !== null) {
      invalidInput([{ path: input.price !== undefined ? 'price' : 'supplier', message: 'A cut piece comes off its hose line: price the hose line' }])
    }
    const now = new Date()
    const set: Partial<ShopLineRow> = {}
    const changes: Change[] = []
    const what = { lineId: line.id, description: line.description }
    const priceChanged = input.price !== undefined && input.price !== (existing?.price ?? null)
    const supplier = input.supplier === undefined ? undefined : (input.supplier || null)
    const supplierChanged = supplier !== undefined && supplier !== (existing?.supplier ?? null)
    if (priceChanged) set.price = input.price ?? null
    if (supplierChanged) set.supplier = supplier ?? null
    if (priceChanged || supplierChanged) changes.push({ action: 'shop.line-priced', details: { ...what, price: input.price ?? existing?.price ?? null, supplier: supplier ?? existing?.supplier ?? null } })
    if (input.bought !== undefined && input.bought !== Boolean(existing?.boughtAt)) {
      set.boughtAt = input.bought ? now : null
      set.boughtBy = input.bought ? member.user.id : null
      const tick = line.parentId !== null ? 'cut' : 'bought'
      changes.push(input.bought
        ? { action: line.parentId !== null ? 'shop.item-cut' : 'shop.item-bought', details: what }
        : { action: 'shop.tick-removed', details: { ...what, tick } })
    }
    if (input.fitted !== undefined && input.fitted !== Boolean(existing?.fittedAt)) {
      set.fittedAt = input.fitted ? now : null
      set.fittedBy = input.fitted ? member.user.id : null
      changes.push(input.fitted ? { action: 'shop.item-fitted', details: what } : { action: 'shop.tick-removed', details: { ...what, tick: 'fitted' } })
    }
    if (reworded.length > 0 && existing?.custom) {
      const custom: StoredCustomLine = { ...existing.custom }
      for (const f of reworded) (custom as unknown as Record<string, unknown>)[f] = input[f]
      if (JSON.stringify(custom) !== JSON.stringify(existing.custom)) {
        set.custom = custom
        changes.push({ action: 'shop.line-changed', details: { ...what, fields: reworded } })
      }
    }
    if (changes.length === 0) return { lineId: line.id, changed: [] as string[] }
    await tx.insert(t).values({ workshopId: member.workshopId, circuitId, version, lineId: line.id, ...set })
      .onConflictDoUpdate({ target: [t.circuitId, t.version, t.lineId], set: { ...set, updatedAt: now } })
    for (const c of changes) await logShopActivity(tx, member, v, c.action, c.details)
    return { lineId: line.id, changed: changes.map((c) => c.action) }
  })
}
