import { and, desc, eq } from 'drizzle-orm'
import { reviewListQuery } from '#shared/schemas/review'

// Reviews of the workshop (e.g. ?state=in-review: what waits for a reviewer), newest first.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'review:read')
  const query = await queryOf(event, reviewListQuery)
  const r = schema.reviews
  const conditions = [eq(r.workshopId, workshopId)]
  if (query.state) conditions.push(eq(r.state, query.state))
  const rows = await useDb().select({
    id: r.id, state: r.state, version: r.version, submittedAt: r.submittedAt, decidedAt: r.decidedAt, summary: r.summary,
    circuitId: r.circuitId, circuitTitle: schema.circuits.title, projectId: schema.projects.id, projectTitle: schema.projects.title,
    submitterName: schema.users.name,
  }).from(r)
    .innerJoin(schema.circuits, eq(schema.circuits.id, r.circuitId))
    .innerJoin(schema.projects, eq(schema.projects.id, schema.circuits.projectId))
    .leftJoin(schema.users, eq(schema.users.id, r.submittedBy))
    .where(and(...conditions))
    .orderBy(desc(r.submittedAt))
    .limit(200)
  return { reviews: rows }
})
