import { idParam } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'circuit:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  const circuit = await findCircuit(db, workshopId, id)
  const project = await findProject(db, workshopId, circuit.projectId)
  return { ...circuit, project: { id: project.id, title: project.title } }
})
