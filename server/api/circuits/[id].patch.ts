import { idParam } from '#shared/schemas/common'
import { circuitRenameInput } from '#shared/schemas/circuitRecord'

// Rename a circuit. The title is part of the drawing's document, so a rename is a new version
// (an editor open elsewhere learns of it at its next save instead of writing the old title back).
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'circuit:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, circuitRenameInput)
  const db = useDb()
  const circuit = await findCircuit(db, workshopId, id)
  const document = await loadCircuitDocument(db, circuit)
  document.circuit.title = input.title
  const saved = await saveCircuit(workshopId, user.id, id, circuit.version, document)
  await logActivity(db, { workshopId, projectId: circuit.projectId, circuitId: id, actorId: user.id, action: 'circuit.renamed', details: { from: circuit.title, to: input.title, version: saved.version } })
  return { ...circuit, title: input.title, version: saved.version }
})
