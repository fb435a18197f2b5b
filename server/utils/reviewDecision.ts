// Approving a review or asking for changes. The review row is locked for the check and the state
// change is one UPDATE … WHERE state = 'in-review' RETURNING, so of two reviewers deciding at once
// exactly one wins; the other gets 409.
import { and, eq } from 'drizzle-orm'
import { approvalBlockers } from '#shared/review'
import { wakeMailWorker } from '../mail/worker'
import type { MemberContext } from './auth'

export async function decideReview(member: MemberContext, reviewId: string, outcome: 'approved' | 'changes-requested', note: string) {
  const result = await useDb().transaction(async (tx) => {
    const review = await findReview(tx, member.workshopId, reviewId, true)
    await assertMayDecide(tx, member, review)
    assertOpen(review)
    if (outcome === 'approved') {
      const frozen = await frozenVersion(tx, review)
      const acks = await tx.select({ key: schema.reviewAcknowledgements.findingKey }).from(schema.reviewAcknowledgements)
        .where(eq(schema.reviewAcknowledgements.reviewId, review.id))
      const blockers = approvalBlockers(frozen.findings, acks.map((a) => a.key))
      const list = (fs: typeof blockers.errors) => fs.map((f) => ({ key: f.key, code: f.code, message: f.message, elementIds: f.elementIds }))
      if (blockers.errors.length > 0) {
        throw createError({
          statusCode: 409, statusMessage: 'Errors block approval',
          message: `Version ${review.version} has ${blockers.errors.length} error finding${blockers.errors.length === 1 ? '' : 's'}: it cannot be approved. Ask for changes instead.`,
          data: { errors: list(blockers.errors), unacknowledged: list(blockers.unacknowledged) },
        })
      }
      if (blockers.unacknowledged.length > 0) {
        throw createError({
          statusCode: 409, statusMessage: 'Warnings not signed off',
          message: `${blockers.unacknowledged.length} warning${blockers.unacknowledged.length === 1 ? ' needs' : 's need'} a reason before approval.`,
          data: { errors: [], unacknowledged: list(blockers.unacknowledged) },
        })
      }
    }
    const r = schema.reviews
    const [decided] = await tx.update(r).set({ state: outcome, decidedBy: member.user.id, decidedAt: new Date(), decisionNote: note })
      .where(and(eq(r.id, review.id), eq(r.workshopId, member.workshopId), eq(r.state, 'in-review'))).returning()
    if (!decided) throw createError({ statusCode: 409, statusMessage: 'Review closed', message: 'Someone decided this review a moment ago.' })
    const circuit = await findCircuit(tx, member.workshopId, decided.circuitId)
    const project = await findProject(tx, member.workshopId, circuit.projectId)
    await logActivity(tx, {
      workshopId: member.workshopId, projectId: circuit.projectId, circuitId: circuit.id, actorId: member.user.id,
      action: outcome === 'approved' ? 'review.approved' : 'review.changes-requested',
      details: { reviewId: decided.id, version: decided.version, title: circuit.title },
    })
    await queueReviewDecided(tx, decided, { id: circuit.id, title: circuit.title, projectTitle: project.title }, { id: member.user.id, name: member.user.name })
    return decided
  })
  wakeMailWorker()
  return result
}
