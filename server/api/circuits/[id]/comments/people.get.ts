import { idParam } from '#shared/schemas/common'

// Who can be mentioned in this circuit's comments: the workshop's members, by name and handle.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'comment:read')
  const { id } = await paramsOf(event, idParam)
  const db = useDb()
  await findCircuit(db, workshopId, id)
  const members = await mentionableMembers(db, workshopId)
  return { people: members.map((m) => ({ id: m.id, name: m.name, handle: m.email.split('@')[0] ?? '' })) }
})
