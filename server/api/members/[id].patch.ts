import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { memberUpdateInput } from '#shared/schemas/membership'

// Change a member's role (owner only; the last owner stays owner).
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'members:manage')
  const { id } = await paramsOf(event, idParam)
  const input = await bodyOf(event, memberUpdateInput)
  return await useDb().transaction(async (tx) => {
    const row = await lockMembership(tx, workshopId, id)
    if (row.role === 'owner' && input.role !== 'owner') await assertAnotherOwner(tx, workshopId, id)
    const [updated] = await tx.update(schema.memberships).set({ role: input.role }).where(eq(schema.memberships.id, id)).returning()
    return updated
  })
})
