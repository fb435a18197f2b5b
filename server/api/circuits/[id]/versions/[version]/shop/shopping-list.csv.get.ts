import { shoppingListCsv } from '#shared/shop'
import { revisionParams } from '#shared/schemas/circuitRecord'

// The version's shopping list as CSV (shared/shop's columns), with the workshop's lines and prices.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:read')
  const { id, version } = await paramsOf(event, revisionParams)
  const db = useDb()
  const v = await loadShopVersion(db, member.workshopId, id, version)
  const csv = shoppingListCsv(listFor(v, await shopLineRows(db, member.workshopId, id, version)))
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${fileSlug(v.circuit.title)}-v${version}-shopping-list.csv"`)
  return csv
})
