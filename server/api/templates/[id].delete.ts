import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// Delete a template. Parts drawn from it are copies and stay as they are.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'template:write')
  const { id } = await paramsOf(event, idParam)
  const t = schema.partTemplates
  const [row] = await useDb().delete(t).where(and(eq(t.id, id), eq(t.workshopId, workshopId))).returning({ id: t.id, name: t.name })
  if (!row) notFound('No such template')
  await logActivity(useDb(), { workshopId, projectId: null, actorId: user.id, action: 'template.deleted', details: { templateId: row.id, name: row.name } })
  return { ok: true }
})
