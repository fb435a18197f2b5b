import { and, eq } from 'drizzle-orm'
import { procedureFor } from '#shared/shop'
import { revisionParams } from '#shared/schemas/circuitRecord'
import { shopStepInput } from '#shared/schemas/shop'

// Ticks a step of the version's procedure (who and when), or takes the tick back.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'shop:record')
  const { id, version } = await paramsOf(event, revisionParams)
  const input = await bodyOf(event, shopStepInput)
  return await useDb().transaction(async (tx) => {
    const v = await loadShopVersion(tx, member.workshopId, id, version)
    const procedure = procedureFor(v.document, v.report)
    if (!procedure.available) throw createError({ statusCode: 409, statusMessage: 'No procedure yet', message: procedure.reason })
    const step = procedure.steps.find((s) => s.id === input.stepId)
    if (!step) invalidInput([{ path: 'stepId', message: 'Not a step of this procedure' }])
    const t = schema.shopSteps
    const details = { stepId: step.id, phase: step.phase, text: step.text.slice(0, 200) }
    if (input.done) {
      const [row] = await tx.insert(t).values({ workshopId: member.workshopId, circuitId: id, version, stepId: step.id, doneBy: member.user.id })
        .onConflictDoNothing().returning()
      if (row) await logShopActivity(tx, member, v, 'shop.step-done', details)
      return { stepId: step.id, done: true, changed: Boolean(row) }
    }
    const [gone] = await tx.delete(t)
      .where(and(eq(t.workshopId, member.workshopId), eq(t.circuitId, id), eq(t.version, version), eq(t.stepId, step.id))).returning()
    if (gone) await logShopActivity(tx, member, v, 'shop.tick-removed', { ...details, tick: 'step' })
    return { stepId: step.id, done: false, changed: Boolean(gone) }
  })
})
