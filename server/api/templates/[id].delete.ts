import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// Delete a template. Parts drawn from it are copies and stay as they are.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'template:write')
  const { id } = await paramsOf(event, idParam)
  const t = schema.partTemplates
  const [row] = await useDb().delete(t).where(and(eq(t.id, id), eq(t.workshopId, workshopId))).returning({ id: t.id })
  if (!row) notFound('No such template')
  return { ok: true }
})
