import { idParam } from '#shared/schemas/common'
import { analyzeCircuit } from '#shared/engine'

// The whole drawn graph as an exchange document, with the engine's report on it.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  const circuit = await findCircuit(db, workshopId, id)
  const document = await loadCircuitDocument(db, circuit)
  return {
    circuit: { id: circuit.id, projectId: circuit.projectId, kind: circuit.kind, title: circuit.title, version: circuit.version, updatedAt: circuit.updatedAt },
    document,
    report: versionReport(circuit.id, circuit.version, circuit.updatedAt, () => analyzeCircuit(document)),
    reviewStatus: await reviewStatusOf(db, workshopId, circuit),
  }
})
