import { can } from '#shared/permissions'
import { revisionParams } from '#shared/schemas/circuitRecord'

// One saved version's shop outputs: the shopping list with the workshop's prices and ticks, the
// procedure with its ticked steps, pressure tests, fills, chart data, and who approved the version.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:read')
  const { id, version } = await paramsOf(event, revisionParams)
  return await shopViewFor(useDb(), member.workshopId, id, version, can(member.role, 'shop:record'))
})
