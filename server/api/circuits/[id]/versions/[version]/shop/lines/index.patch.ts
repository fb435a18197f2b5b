import { revisionParams } from '#shared/schemas/circuitRecord'
import { shopLinePatchInput } from '#shared/schemas/shop'

// Price, supplier and ticks on a line of the version's shopping list; wording on the workshop's own lines.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:record')
  const { id, version } = await paramsOf(event, revisionParams)
  const input = await bodyOf(event, shopLinePatchInput)
  return await patchShopLine(member, id, version, input)
})
