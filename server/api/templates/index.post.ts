import { templateInput } from '#shared/schemas/template'

// Save a part as a template of this workshop. Names are unique per workshop, whatever their case.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'template:write')
  const input = await bodyOf(event, templateInput)
  const [row] = await useDb().insert(schema.partTemplates).values({
    workshopId, name: input.name, type: input.body.type, body: input.body as Record<string, unknown>, createdBy: user.id,
  }).onConflictDoNothing().returning()
  if (!row) invalidInput([{ path: 'name', message: `A template named “${input.name}” already exists in this workshop` }], 'Choose another name.')
  await logActivity(useDb(), { workshopId, projectId: null, actorId: user.id, action: 'template.created', details: { templateId: row.id, name: row.name } })
  setResponseStatus(event, 201)
  return row
})
