import type { Database } from './db'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

export interface OutgoingMail {
  workshopId: string | null
  /** what the mail is for: invitation, password-reset, review-requested, review-approved, changes-requested, mention … */
  kind: string
  to: string
  subject: string
  text: string
  html?: string
  attachments?: Array<{ kind: string; ref: string; filename: string }>
}

/**
 * Queues an e-mail in the same transaction as the action that causes it. The mail worker
 * (server/plugins/mailWorker.ts) sends it with retries; nothing here talks to SMTP.
 */
export async function enqueueMail(tx: Executor, mail: OutgoingMail) {
  const [row] = await tx.insert(schema.mailOutbox).values({
    workshopId: mail.workshopId, kind: mail.kind, toAddress: mail.to, subject: mail.subject,
    textBody: mail.text, htmlBody: mail.html ?? null, attachments: mail.attachments ?? [],
  }).returning({ id: schema.mailOutbox.id })
  return row!.id
}

/** The address people reach the app at, for links in e-mails. */
export function appUrl(): string {
  return (process.env.HOSEWRIGHT_APP_URL || `http://${process.env.NITRO_HOST || process.env.HOST || '127.0.0.1'}:${process.env.NITRO_PORT || process.env.PORT || 3000}`).replace(/\/$/, '')
}
