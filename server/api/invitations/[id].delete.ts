import { and, eq, isNull } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'

// Withdraw an open invitation (owner only): its link stops working at once.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'members:manage')
  const { id } = await paramsOf(event, idParam)
  await useDb().transaction(async (tx) => {
    const [row] = await tx.update(schema.invitations).set({ revokedAt: new Date() }).where(and(
      eq(schema.invitations.id, id), eq(schema.invitations.workshopId, workshopId),
      isNull(schema.invitations.acceptedAt), isNull(schema.invitations.revokedAt))).returning()
    if (!row) notFound('No open invitation with this id')
    await logActivity(tx, { workshopId, projectId: null, actorId: user.id, action: 'member.invitation-revoked', details: { email: row.email } })
  })
  return { ok: true }
})
