import { idParam } from '#shared/schemas/common'

// Download the circuit as a Hosewright exchange document (.json).
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  const circuit = await findCircuit(db, workshopId, id)
  const document = await loadCircuitDocument(db, circuit)
  const safeName = circuit.title.normalize('NFKD').replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 80) || 'circuit'
  setResponseHeader(event, 'content-type', 'application/json; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${safeName}.v${circuit.version}.hosewright.json"`)
  return JSON.stringify(document, null, 2)
})
