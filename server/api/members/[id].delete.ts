import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// Remove a member from the workshop (their account stays; the last owner cannot be removed).
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'members:manage')
  const { id } = await paramsOf(event, idParam)
  await useDb().transaction(async (tx) => {
    const row = await lockMembership(tx, workshopId, id)
    if (row.role === 'owner') await assertAnotherOwner(tx, workshopId, id)
    await tx.delete(schema.memberships).where(eq(schema.memberships.id, id))
  })
  return { ok: true }
})
