import { and, asc, desc, eq, ilike, ne, or, sql, count } from 'drizzle-orm'
import { projectListQuery } from '#shared/schemas/project'

// Projects of the current workshop: search, status filter, sort, pagination.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'project:read')
  const query = await queryOf(event, projectListQuery)
  const p = schema.projects
  const conditions = [eq(p.workshopId, workshopId)]
  if (query.status === 'active') conditions.push(ne(p.status, 'archived'))
  else if (query.status !== 'all') conditions.push(eq(p.status, query.status))
  if (query.q) {
    const pattern = `%${query.q.replace(/[\\%_]/g, c => `\\${c}`)}%`
    conditions.push(or(ilike(p.title, pattern), ilike(p.vehicle, pattern), ilike(p.engine, pattern))!)
  }
  const where = and(...conditions)
  const column = { updatedAt: p.updatedAt, createdAt: p.createdAt, title: p.title, dueDate: p.dueDate, status: p.status }[query.sort]
  const order = query.dir === 'asc' ? asc(column) : desc(column)
  const db = useDb()
  const [items, [total]] = await Promise.all([
    db.select({
      id: p.id, title: p.title, vehicle: p.vehicle, engine: p.engine, status: p.status, dueDate: p.dueDate,
      updatedAt: p.updatedAt, createdAt: p.createdAt,
      // qualified by hand: inside a sub-select drizzle would print the bare column name
      circuitCount: sql<number>`(select count(*)::int from circuits c where c.project_id = projects.id)`,
    }).from(p).where(where)
      // nulls (no due date) last either way; id breaks ties so pages never overlap
      .orderBy(sql`${column} is null`, order, asc(p.id))
      .limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    db.select({ n: count() }).from(p).where(where),
  ])
  return { items, total: total?.n ?? 0, page: query.page, pageSize: query.pageSize }
})
