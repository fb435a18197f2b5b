import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// Archive a project: hidden from the default list, nothing deleted.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'project:write')
  const { id } = await paramsOf(event, idParam)
  const [row] = await useDb().update(schema.projects).set({ status: 'archived', updatedAt: new Date() })
    .where(and(eq(schema.projects.id, id), eq(schema.projects.workshopId, workshopId)))
    .returning()
  if (!row) notFound('No such project')
  return row
})
