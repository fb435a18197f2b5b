import { and, desc, eq } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'
import { idParam } from '#shared/schemas/common'

// Reviews of a circuit, newest first, with the circuit's review status.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'review:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  const circuit = await findCircuit(db, workshopId, id)
  const r = schema.reviews
  const submitter = alias(schema.users, 'submitter')
  const decider = alias(schema.users, 'decider')
  const rows = await db.select({ review: r, submitterName: submitter.name, deciderName: decider.name }).from(r)
    .leftJoin(submitter, eq(submitter.id, r.submittedBy))
    .leftJoin(decider, eq(decider.id, r.decidedBy))
    .where(and(eq(r.circuitId, id), eq(r.workshopId, workshopId)))
    .orderBy(desc(r.submittedAt), desc(r.version))
    .limit(200)
  return {
    reviews: rows.map(({ review, submitterName, deciderName }) => ({
      ...review,
      submitter: review.submittedBy ? { id: review.submittedBy, name: submitterName ?? '' } : null,
      decider: review.decidedBy ? { id: review.decidedBy, name: deciderName ?? '' } : null,
    })),
    reviewStatus: await reviewStatusOf(db, workshopId, circuit),
  }
})
