import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { reviewSettingsInput, reviewSettingsOf } from '#shared/schemas/review'

// Owners change the workshop's review settings, e.g. { fabricatorMayApproveOwn: true }.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'workshop:settings')
  const { id } = await paramsOf(event, idParam)
  if (id !== workshopId) notFound('No such workshop')
  const input = await bodyOf(event, reviewSettingsInput)
  return await useDb().transaction(async (tx) => {
    const [w] = await tx.select().from(schema.workshops).where(eq(schema.workshops.id, workshopId)).for('update')
    if (!w) notFound('No such workshop')
    const review = { ...reviewSettingsOf(w.settings), ...input }
    await tx.update(schema.workshops).set({ settings: { ...w.settings, review } }).where(eq(schema.workshops.id, workshopId))
    await logActivity(tx, { workshopId, projectId: null, actorId: user.id, action: 'workshop.review-settings', details: review })
    return { review }
  })
})
