import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { circuitCreateInput } from '#shared/schemas/circuitRecord'

export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, circuitCreateInput)
  const row = await useDb().transaction(async (tx) => {
    await findProject(tx, workshopId, id)
    const [circuit] = await tx.insert(schema.circuits).values({ ...input, projectId: id, workshopId }).returning()
    await tx.update(schema.projects).set({ updatedAt: new Date() }).where(eq(schema.projects.id, id))
    return circuit
  })
  setResponseStatus(event, 201)
  return row
})
