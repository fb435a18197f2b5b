import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { circuitCreateInput } from '#shared/schemas/circuitRecord'

export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'circuit:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, circuitCreateInput)
  const row = await useDb().transaction(async (tx) => {
    await findProject(tx, workshopId, id)
    const document = emptyCircuitDocument(input.kind, input.title)
    const [circuit] = await tx.insert(schema.circuits)
      .values({ ...input, projectId: id, workshopId, settings: document.circuit.settings as Record<string, unknown> }).returning()
    // version 1 is the empty drawing, kept like every later version
    await storeVersion(tx, circuit!, circuit!.version, document, user.id)
    await logActivity(tx, { workshopId, projectId: id, circuitId: circuit!.id, actorId: user.id, action: 'circuit.created', details: { title: circuit!.title, kind: circuit!.kind } })
    await tx.update(schema.projects).set({ updatedAt: new Date() }).where(eq(schema.projects.id, id))
    return circuit
  })
  setResponseStatus(event, 201)
  return row
})
