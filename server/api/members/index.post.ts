import { and, eq } from 'drizzle-orm'
import { memberAddInput } from '#shared/schemas/membership'
import { wakeMailWorker } from '../../mail/worker'

// Invite someone by e-mail (owner only). They get a link; accepting it creates their account (or
// links an existing one) and the membership. Nobody joins a workshop without following the link.
export default defineEventHandler(async (event) => {
  const { workshopId, user } = await requireMember(event, 'members:manage')
  const input = await bodyOf(event, memberAddInput)
  const invitation = await useDb().transaction(async (tx) => {
    const [member] = await tx.select({ id: schema.memberships.id }).from(schema.memberships)
      .innerJoin(schema.users, eq(schema.users.id, schema.memberships.userId))
      .where(and(eq(schema.memberships.workshopId, workshopId), eq(schema.users.email, input.email)))
    if (member) return null
    const row = await createInvitation(tx, { workshopId, email: input.email, name: input.name ?? null, role: input.role, invitedBy: user.id })
    await logActivity(tx, { workshopId, projectId: null, actorId: user.id, action: 'member.invited', details: { email: row.email, role: row.role } })
    return row
  })
  if (!invitation) invalidInput([{ path: 'email', message: 'This person is already a member of this workshop' }])
  wakeMailWorker()
  setResponseStatus(event, 201)
  return {
    id: invitation.id, email: invitation.email, name: invitation.name, role: invitation.role,
    createdAt: invitation.createdAt, expiresAt: invitation.expiresAt,
  }
})
