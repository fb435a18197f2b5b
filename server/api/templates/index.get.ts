import { and, asc, eq, ilike, or, sql } from 'drizzle-orm'
import { templateListQuery } from '#shared/schemas/template'

// The workshop's part templates, by name; ?q= searches names, part types and part labels.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'template:read')
  const query = await queryOf(event, templateListQuery)
  const t = schema.partTemplates
  const conditions = [eq(t.workshopId, workshopId)]
  if (query.q) {
    const pattern = `%${query.q.replace(/[\\%_]/g, c => `\\${c}`)}%`
    conditions.push(or(ilike(t.name, pattern), ilike(t.type, pattern), ilike(sql`${t.body}->>'label'`, pattern))!)
  }
  return await useDb().select().from(t).where(and(...conditions)).orderBy(sql`lower(${t.name})`, asc(t.id))
})
