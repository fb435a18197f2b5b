import { idParam } from '#shared/schemas/common'

// The current workshop's review settings. Another workshop's id answers 404, like any other row.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'workshop:read')
  const { id } = await paramsOf(event, idParam)
  if (id !== workshopId) notFound('No such workshop')
  return { review: await workshopReviewSettings(useDb(), workshopId) }
})
