import { revisionParams } from '#shared/schemas/circuitRecord'
import { pressureTestInput, pressureToKpa } from '#shared/schemas/shop'

// A pressure test as read off the gauge, in the unit it was read in; stored as gauge kPa. A version
// may be tested several times (after a leak is fixed, after the first drive …).
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:record')
  const { id, version } = await paramsOf(event, revisionParams)
  const input = await bodyOf(event, pressureTestInput)
  const startKpa = pressureToKpa(input.startPressure, input.unit)
  const endKpa = pressureToKpa(input.endPressure, input.unit)
  const row = await useDb().transaction(async (tx) => {
    const v = await loadShopVersion(tx, member.workshopId, id, version)
    const [row] = await tx.insert(schema.shopPressureTests).values({
      workshopId: member.workshopId, circuitId: id, version, startKpa, endKpa, minutesHeld: input.minutesHeld,
      passed: input.passed, enteredUnit: input.unit, note: input.note, recordedBy: member.user.id,
    }).returning()
    await logShopActivity(tx, member, v, 'shop.pressure-test', { testId: row!.id, passed: input.passed, startKpa, endKpa, minutesHeld: input.minutesHeld })
    return row!
  })
  setResponseStatus(event, 201)
  return { id: row.id, startKpa: row.startKpa, endKpa: row.endKpa, minutesHeld: row.minutesHeld, passed: row.passed, enteredUnit: row.enteredUnit, note: row.note, at: row.createdAt }
})
