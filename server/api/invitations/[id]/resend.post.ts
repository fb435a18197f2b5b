import { and, eq, isNull } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { wakeMailWorker } from '../../../mail/worker'

// Send an open (or expired) invitation again with a new link and a new expiry (owner only).
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'members:manage')
  const { id } = await paramsOf(event, idParam)
  const updated = await useDb().transaction(async (tx) => {
    const [row] = await tx.select().from(schema.invitations).where(and(
      eq(schema.invitations.id, id), eq(schema.invitations.workshopId, workshopId),
      isNull(schema.invitations.acceptedAt), isNull(schema.invitations.revokedAt))).for('update')
    if (!row) notFound('No open invitation with this id')
    return await resendInvitation(tx, row, user.id)
  })
  wakeMailWorker()
  return { id: updated.id, email: updated.email, role: updated.role, expiresAt: updated.expiresAt }
})
