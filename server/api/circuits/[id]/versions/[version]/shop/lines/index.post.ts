import { randomUUID } from 'node:crypto'
import { revisionParams } from '#shared/schemas/circuitRecord'
import { shopCustomLineInput } from '#shared/schemas/shop'

// A line the workshop adds to the version's shopping list (heat sleeve, cable ties …).
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:record')
  const { id, version } = await paramsOf(event, revisionParams)
  const input = await bodyOf(event, shopCustomLineInput)
  const lineId = await useDb().transaction(async (tx) => {
    const v = await loadShopVersion(tx, member.workshopId, id, version)
    const lineId = `${CUSTOM_PREFIX}${randomUUID().slice(0, 8)}`
    await tx.insert(schema.shopLines).values({
      workshopId: member.workshopId, circuitId: id, version, lineId, price: input.price, supplier: input.supplier || null,
      custom: { description: input.description, quantity: input.quantity, unit: input.unit, section: input.section, sizeMetric: input.sizeMetric, sizeImperial: input.sizeImperial, notes: input.notes },
    })
    await logShopActivity(tx, member, v, 'shop.line-added', { lineId, description: input.description, quantity: input.quantity, unit: input.unit })
    return lineId
  })
  setResponseStatus(event, 201)
  return { lineId }
})
