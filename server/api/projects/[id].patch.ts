import { and, eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { projectUpdateInput } from '#shared/schemas/project'

export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'project:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, projectUpdateInput)
  const [row] = await useDb().update(schema.projects).set({ ...input, updatedAt: new Date() })
    .where(and(eq(schema.projects.id, id), eq(schema.projects.workshopId, workshopId)))
    .returning()
  if (!row) notFound('No such project')
  return row
})
