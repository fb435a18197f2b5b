import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { circuitImportInput } from '#shared/schemas/circuitRecord'

// Import an exchange document as a NEW circuit of the project: an import never overwrites.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'circuit:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, circuitImportInput)
  const document = documentOrFail(input.document)
  if (input.title) document.circuit.title = input.title
  const created = await useDb().transaction(async (tx) => {
    await findProject(tx, workshopId, id)
    const [circuit] = await tx.insert(schema.circuits).values({
      workshopId, projectId: id, kind: document.circuit.kind, title: document.circuit.title,
      settings: document.circuit.settings as Record<string, unknown>, notes: document.circuit.notes ?? null,
    }).returning()
    const report = await storeVersion(tx, circuit!, circuit!.version, document, user.id)
    await logActivity(tx, { workshopId, projectId: id, circuitId: circuit!.id, actorId: user.id, action: 'circuit.imported', details: { title: circuit!.title, kind: circuit!.kind } })
    await tx.update(schema.projects).set({ updatedAt: new Date() }).where(eq(schema.projects.id, id))
    return { circuit: circuit!, report }
  })
  setResponseStatus(event, 201)
  return created
})
