import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'template:read')
  const { id } = await paramsOf(event, idParam)
  const t = schema.partTemplates
  const [row] = await useDb().select().from(t).where(and(eq(t.id, id), eq(t.workshopId, workshopId)))
  if (!row) notFound('No such template')
  return row
})
