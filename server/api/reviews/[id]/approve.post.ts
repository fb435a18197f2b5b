import { idParam } from '#shared/schemas/common'
import { reviewApproveInput } from '#shared/schemas/review'

// Approve the frozen version: refused with 409 and the list while it has an error finding or a
// warning nobody has signed off.
export default defineEventHandler(async (event) => {
  const member = await requireMember(event, 'review:read')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, reviewApproveInput)
  return await decideReview(member, id, 'approved', input.note)
})
