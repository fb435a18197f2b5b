import { idParam } from '#shared/schemas/common'
import { reviewChangesInput } from '#shared/schemas/review'

// Send the version back to the fabricator with a note saying what to change.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:read')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, reviewChangesInput)
  return await decideReview(member, id, 'changes-requested', input.note)
})
