import { asc, eq, inArray } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { approvalBlockers, canApprove, decisionRefusalText } from '#shared/review'

// One review: the frozen version's document and report (the same engine as everywhere), each finding
// with its key and sign-off, what still blocks approval, and whether the viewer may decide.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  const review = await findReview(db, member.workshopId, id)
  const circuit = await findCircuit(db, member.workshopId, review.circuitId)
  const project = await findProject(db, member.workshopId, circuit.projectId)
  const frozen = await frozenVersion(db, review)
  const a = schema.reviewAcknowledgements
  const acks = await db.select({ ack: a, byName: schema.users.name }).from(a)
    .leftJoin(schema.users, eq(schema.users.id, a.acknowledgedBy))
    .where(eq(a.reviewId, review.id)).orderBy(asc(a.createdAt))
  const acknowledgements = acks.map(({ ack, byName }) => ({
    id: ack.id, findingKey: ack.findingKey, justification: ack.justification, createdAt: ack.createdAt,
    by: ack.acknowledgedBy ? { id: ack.acknowledgedBy, name: byName ?? '' } : null,
  }))
  const ackByKey = new Map(acknowledgements.map((x) => [x.findingKey, x]))
  const blockers = approvalBlockers(frozen.findings, ackByKey.keys())
  const personIds = [review.submittedBy, review.decidedBy].filter((x): x is string => x !== null)
  const people = personIds.length
    ? await db.select({ id: schema.users.id, name: schema.users.name }).from(schema.users).where(inArray(schema.users.id, personIds))
    : []
  const nameOf = (userId: string | null) => people.find((p) => p.id === userId) ?? null
  const refusal = review.state === 'in-review' ? refusalFor(member, review, await workshopReviewSettings(db, member.workshopId)) : null
  return {
    review: { ...review, submitter: nameOf(review.submittedBy), decider: nameOf(review.decidedBy) },
    circuit: { id: circuit.id, title: circuit.title, kind: circuit.kind, projectId: circuit.projectId, currentVersion: circuit.version },
    project: { id: project.id, title: project.title },
    document: frozen.document,
    report: frozen.report,
    findings: frozen.findings.map((f) => ({ ...f, acknowledgement: ackByKey.get(f.key) ?? null })),
    // sign-offs whose finding is no longer in the report (they cannot be: the version is frozen) are still shown
    acknowledgements,
    blockers: { errors: blockers.errors.map((f) => f.key), unacknowledged: blockers.unacknowledged.map((f) => f.key) },
    canApprove: review.state === 'in-review' && canApprove(blockers),
    viewer: { mayDecide: review.state === 'in-review' && refusal === null, refusal: refusal ? decisionRefusalText[refusal] : null },
    reviewStatus: await reviewStatusOf(db, member.workshopId, circuit),
  }
})
