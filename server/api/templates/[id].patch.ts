import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { templateUpdateInput } from '#shared/schemas/template'

// Rename a template or replace its part. Parts already drawn from it keep what they were placed with.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'template:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, templateUpdateInput)
  const t = schema.partTemplates
  const changes: Partial<typeof t.$inferInsert> = { updatedAt: new Date() }
  if (input.name !== undefined) changes.name = input.name
  if (input.body !== undefined) Object.assign(changes, { type: input.body.type, body: input.body as Record<string, unknown> })
  try {
    const [row] = await useDb().update(t).set(changes).where(and(eq(t.id, id), eq(t.workshopId, workshopId))).returning()
    if (!row) notFound('No such template')
    await logActivity(useDb(), { workshopId, projectId: null, actorId: user.id, action: 'template.updated', details: { templateId: row.id, name: row.name } })
    return row
  } catch (error) {
    if (isUniqueViolation(error)) {
      invalidInput([{ path: 'name', message: `A template named “${input.name}” already exists in this workshop` }], 'Choose another name.')
    }
    throw error
  }
})

/** PostgreSQL's unique_violation, under however many wrappers the query layer adds. */
function isUniqueViolation(error: unknown): boolean {
  for (let e = error as { code?: string; cause?: unknown } | undefined; e; e = e.cause as typeof e) {
    if (e.code === '23505') return true
  }
  return false
}
