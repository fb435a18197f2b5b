import { revisionParams } from '#shared/schemas/circuitRecord'
import { fillRecordInput, volumeToLitres } from '#shared/schemas/shop'

// The coolant that actually went in, against the report's system volume (kept with the record).
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:record')
  const { id, version } = await paramsOf(event, revisionParams)
  const input = await bodyOf(event, fillRecordInput)
  const volumeL = volumeToLitres(input.volume, input.unit)
  const row = await useDb().transaction(async (tx) => {
    const v = await loadShopVersion(tx, member.workshopId, id, version)
    const estimateL = v.report.quantities.volume.totalL
    const [row] = await tx.insert(schema.shopFills).values({
      workshopId: member.workshopId, circuitId: id, version, volumeL, estimateL, enteredUnit: input.unit, note: input.note, recordedBy: member.user.id,
    }).returning()
    await logShopActivity(tx, member, v, 'shop.fill-recorded', { fillId: row!.id, volumeL, estimateL, differenceL: volumeL - estimateL })
    return row!
  })
  setResponseStatus(event, 201)
  return { id: row.id, volumeL: row.volumeL, estimateL: row.estimateL, differenceL: row.volumeL - row.estimateL, enteredUnit: row.enteredUnit, note: row.note, at: row.createdAt }
})
