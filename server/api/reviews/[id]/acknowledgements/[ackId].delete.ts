import { and, eq } from 'drizzle-orm'
import { acknowledgementParams } from '#shared/schemas/review'

// Take a sign-off back while the review is open.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:read')
  const { id, ackId } = await paramsOf(event, acknowledgementParams)
  await useDb().transaction(async (tx) => {
    const review = await findReview(tx, member.workshopId, id, true)
    await assertMayDecide(tx, member, review)
    assertOpen(review)
    const a = schema.reviewAcknowledgements
    const [gone] = await tx.delete(a).where(and(eq(a.id, ackId), eq(a.reviewId, review.id), eq(a.workshopId, member.workshopId))).returning({ id: a.id })
    if (!gone) notFound('No such sign-off')
  })
  return { ok: true }
})
