import { sql } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { acknowledgementInput } from '#shared/schemas/review'

// Sign a warning off with a reason. Signing it again replaces the reason.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:read')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, acknowledgementInput)
  const ack = await useDb().transaction(async (tx) => {
    const review = await findReview(tx, member.workshopId, id, true)
    await assertMayDecide(tx, member, review)
    assertOpen(review)
    const finding = (await frozenVersion(tx, review)).findings.find((f) => f.key === input.findingKey)
    if (!finding) invalidInput([{ path: 'findingKey', message: 'This version has no such finding' }])
    if (finding.severity !== 'warning') {
      invalidInput([{ path: 'findingKey', message: finding.severity === 'error' ? 'Errors cannot be signed off: they must be fixed' : 'Notes need no sign-off' }])
    }
    const a = schema.reviewAcknowledgements
    const [row] = await tx.insert(a).values({
      workshopId: member.workshopId, reviewId: review.id, findingKey: input.findingKey, justification: input.justification, acknowledgedBy: member.user.id,
    }).onConflictDoUpdate({
      target: [a.reviewId, a.findingKey],
      set: { justification: input.justification, acknowledgedBy: member.user.id, createdAt: sql`now()` },
    }).returning()
    return row!
  })
  setResponseStatus(event, 201)
  return { ...ack, by: { id: member.user.id, name: member.user.name } }
})
