import { projectInput } from '#shared/schemas/project'

export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'project:write')
  const input = await bodyOf(event, projectInput)
  const [row] = await useDb().insert(schema.projects).values({ ...input, workshopId, createdBy: user.id }).returning()
  setResponseStatus(event, 201)
  return row
})
