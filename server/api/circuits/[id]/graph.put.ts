import { idParam } from '#shared/schemas/common'
import { circuitSaveInput } from '#shared/schemas/circuitRecord'

// Save the whole graph. A stale baseVersion answers 409 and writes nothing.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'circuit:write')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, circuitSaveInput)
  const document = documentOrFail(input.document)
  const saved = await saveCircuit(workshopId, user.id, id, input.baseVersion, document)
  // the save is done; a failed log line must not make the editor think otherwise
  await findCircuit(useDb(), workshopId, id)
    .then(c => logCircuitEdited(workshopId, c.projectId, id, user.id, saved.version))
    .catch(error => console.error('activity: circuit.edited not logged', error))
  return saved
})
