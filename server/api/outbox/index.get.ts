import { desc, eq } from 'drizzle-orm'

// The workshop's outgoing mail for the development outbox page (owner only; 404 unless
// HOSEWRIGHT_MAIL_OUTBOX_PAGE=1). Account mail (password resets) belongs to no workshop and is not shown.
export default defineEventHandler(async (event) => {
  if (!outboxPageEnabled()) notFound()
  const { workshopId } = await requireMember(event, 'members:manage')
  const t = schema.mailOutbox
  return await useDb().select({
    id: t.id, kind: t.kind, to: t.toAddress, subject: t.subject, text: t.textBody,
    attachments: t.attachments, status: t.status, attempts: t.attempts, nextAttemptAt: t.nextAttemptAt,
    lastError: t.lastError, createdAt: t.createdAt, sentAt: t.sentAt,
  }).from(t).where(eq(t.workshopId, workshopId)).orderBy(desc(t.createdAt)).limit(200)
})
