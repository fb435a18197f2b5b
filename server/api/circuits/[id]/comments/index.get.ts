import { idParam } from '#shared/schemas/common'

// Every comment of the circuit, oldest first; the panel groups them into threads.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'comment:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  await findCircuit(db, workshopId, id)
  return { comments: await commentItems(db, workshopId, id) }
})
