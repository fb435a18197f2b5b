import { and, eq, isNotNull } from 'drizzle-orm'
import { revisionParams } from '#shared/schemas/circuitRecord'
import { shopLineDeleteQuery } from '#shared/schemas/shop'

// Removes a line the workshop added; the engine's lines come from the drawing and stay.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:record')
  const { id, version } = await paramsOf(event, revisionParams)
  const { lineId } = await queryOf(event, shopLineDeleteQuery)
  if (!lineId.startsWith(CUSTOM_PREFIX)) invalidInput([{ path: 'lineId', message: 'Only lines the workshop added can be removed' }])
  await useDb().transaction(async (tx) => {
    const v = await loadShopVersion(tx, member.workshopId, id, version)
    const t = schema.shopLines
    const [gone] = await tx.delete(t)
      .where(and(eq(t.workshopId, member.workshopId), eq(t.circuitId, id), eq(t.version, version), eq(t.lineId, lineId), isNotNull(t.custom)))
      .returning()
    if (!gone) notFound('No such line')
    await logShopActivity(tx, member, v, 'shop.line-removed', { lineId, description: gone.custom?.description ?? '' })
  })
  setResponseStatus(event, 204)
  return null
})
