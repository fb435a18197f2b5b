import { and, desc, eq, isNull } from 'drizzle-orm'
import { alias } from 'drizzle-orm/pg-core'

// Open invitations of the current workshop (owner only), with how their e-mail is doing.
export default defineEventHandler(async (event) => {
  const { workshopId } = await requireMember(event, 'members:manage')
  const inviter = alias(schema.users, 'inviter')
  const rows = await useDb().select({
    id: schema.invitations.id, email: schema.invitations.email, name: schema.invitations.name,
    role: schema.invitations.role, createdAt: schema.invitations.createdAt, expiresAt: schema.invitations.expiresAt,
    invitedBy: inviter.name,
    mailStatus: schema.mailOutbox.status, mailAttempts: schema.mailOutbox.attempts,
    mailError: schema.mailOutbox.lastError, mailSentAt: schema.mailOutbox.sentAt,
  }).from(schema.invitations)
    .leftJoin(inviter, eq(inviter.id, schema.invitations.invitedBy))
    .leftJoin(schema.mailOutbox, eq(schema.mailOutbox.id, schema.invitations.mailId))
    .where(and(eq(schema.invitations.workshopId, workshopId), isNull(schema.invitations.acceptedAt), isNull(schema.invitations.revokedAt)))
    .orderBy(desc(schema.invitations.createdAt))
  const now = Date.now()
  return {
    invitations: rows.map(({ mailStatus, mailAttempts, mailError, mailSentAt, ...row }) => ({
      ...row,
      expired: row.expiresAt.getTime() <= now,
      mail: mailStatus ? { status: mailStatus, attempts: mailAttempts, lastError: mailError, sentAt: mailSentAt } : null,
    })),
    /** whether the development outbox page is available, for a link to it */
    outboxPage: outboxPageEnabled(),
  }
})
