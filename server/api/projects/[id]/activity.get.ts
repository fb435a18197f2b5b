import { and, count, desc, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { activityActions, activityQuery } from '#shared/schemas/review'

// The project's activity log, newest first: filter by action, person and circuit; 50 a page.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'activity:read')
  const { id } = await paramsOf(event, idParam)
  const query = await queryOf(event, activityQuery)
  const db = useDb()
  await findProject(db, workshopId, id)
  const a = schema.activity
  const conditions = [eq(a.workshopId, workshopId), eq(a.projectId, id)]
  if (query.action) conditions.push(eq(a.action, query.action))
  if (query.actorId) conditions.push(eq(a.actorId, query.actorId))
  if (query.circuitId) conditions.push(eq(a.circuitId, query.circuitId))
  const where = and(...conditions)
  const [rows, [total], actors, circuits] = await Promise.all([
    db.select({
      id: a.id, action: a.action, details: a.details, createdAt: a.createdAt, circuitId: a.circuitId, actorId: a.actorId,
      actorName: schema.users.name, circuitTitle: schema.circuits.title,
    }).from(a)
      .leftJoin(schema.users, eq(schema.users.id, a.actorId))
      .leftJoin(schema.circuits, eq(schema.circuits.id, a.circuitId))
      .where(where).orderBy(desc(a.createdAt), desc(a.id))
      .limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    db.select({ n: count() }).from(a).where(where),
    db.selectDistinct({ id: schema.users.id, name: schema.users.name }).from(a)
      .innerJoin(schema.users, eq(schema.users.id, a.actorId))
      .where(and(eq(a.workshopId, workshopId), eq(a.projectId, id))),
    db.select({ id: schema.circuits.id, title: schema.circuits.title }).from(schema.circuits)
      .where(and(eq(schema.circuits.workshopId, workshopId), eq(schema.circuits.projectId, id))),
  ])
  return {
    items: rows.map((r) => ({
      id: r.id, action: r.action, details: r.details, createdAt: r.createdAt,
      actor: r.actorId ? { id: r.actorId, name: r.actorName ?? '' } : null,
      // a deleted circuit keeps its title in the line's details
      circuit: r.circuitId ? { id: r.circuitId, title: r.circuitTitle ?? '' } : null,
    })),
    total: total?.n ?? 0, page: query.page, pageSize: query.pageSize,
    filters: { actions: activityActions, actors: actors.sort((x, y) => x.name.localeCompare(y.name)), circuits },
  }
})
