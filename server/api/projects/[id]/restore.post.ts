import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// Bring an archived project back to the list, in planning.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'project:write')
  const { id } = await paramsOf(event, idParam)
  const [row] = await useDb().update(schema.projects).set({ status: 'planning', updatedAt: new Date() })
    .where(and(eq(schema.projects.id, id), eq(schema.projects.workshopId, workshopId), eq(schema.projects.status, 'archived')))
    .returning()
  if (!row) notFound('No archived project with this id')
  return row
})
