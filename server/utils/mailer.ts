import { createTransport, type Transporter } from 'nodemailer'
import type { OutboxRow } from '../database/schema'

// SMTP delivery for the outbox worker. Routes never send directly: they queue with enqueueMail()
// (server/utils/outbox.ts) inside their own transaction; server/mail/worker.ts calls deliverMail().

export type MailAttachmentRef = OutboxRow['attachments'][number]

export interface ResolvedAttachment {
  content: Buffer | Uint8Array
  contentType?: string
  /** overrides the filename queued with the mail */
  filename?: string
}

/** Produces an attachment's bytes at send time (e.g. the build-sheet PDF of a circuit version). */
export type AttachmentResolver = (attachment: MailAttachmentRef, mail: Pick<OutboxRow, 'id' | 'workshopId' | 'kind'>) => Promise<ResolvedAttachment>

/** A failure that another attempt cannot fix: the row is marked failed at once, without retries. */
export class PermanentMailError extends Error {
  override name = 'PermanentMailError'
}

const resolvers = new Map<string, AttachmentResolver>()

/** Registers how attachments of one kind are produced. Call it from a Nitro plugin. */
export function registerAttachmentResolver(kind: string, resolve: AttachmentResolver) {
  resolvers.set(kind, resolve)
}

export function mailFrom(): string {
  return process.env.MAIL_FROM || 'Hosewright <hosewright@localhost>'
}

/** True when an SMTP server is configured; without one, mail stays queued. */
export function mailConfigured(): boolean {
  return Boolean(process.env.SMTP_HOST)
}

let transport: Transporter | undefined

function smtpTransport(): Transporter {
  if (transport) return transport
  const secure = process.env.SMTP_SECURE === '1' || process.env.SMTP_SECURE === 'true'
  const user = process.env.SMTP_USER
  transport = createTransport({
    host: process.env.SMTP_HOST,
    port: Number(process.env.SMTP_PORT || (secure ? 465 : 587)),
    secure,
    // the development catcher speaks plain SMTP on loopback only
    ignoreTLS: process.env.SMTP_IGNORE_TLS === '1',
    auth: user ? { user, pass: process.env.SMTP_PASS ?? '' } : undefined,
    // far below the worker's "sending" lease, so a hung server ends as a failed attempt
    connectionTimeout: 15_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
  })
  return transport
}

async function resolveAttachments(row: OutboxRow) {
  return await Promise.all(row.attachments.map(async (attachment) => {
    const resolve = resolvers.get(attachment.kind)
    if (!resolve) throw new PermanentMailError(`No attachment resolver is registered for kind "${attachment.kind}" (${attachment.filename})`)
    const resolved = await resolve(attachment, { id: row.id, workshopId: row.workshopId, kind: row.kind })
    return {
      filename: resolved.filename ?? attachment.filename,
      content: Buffer.from(resolved.content),
      contentType: resolved.contentType,
    }
  }))
}

/** Sends one outbox row. Throws on failure; SMTP 5xx answers and unknown attachments are permanent. */
export async function deliverMail(row: OutboxRow): Promise<void> {
  const attachments = await resolveAttachments(row)
  try {
    await smtpTransport().sendMail({
      from: mailFrom(),
      to: row.toAddress,
      subject: row.subject,
      text: row.textBody,
      html: row.htmlBody ?? undefined,
      attachments,
      headers: { 'X-Hosewright-Mail': row.id },
    })
  } catch (error) {
    const code = (error as { responseCode?: number }).responseCode
    if (code && code >= 500) throw new PermanentMailError((error as Error).message)
    throw error
  }
}

export function closeMailTransport() {
  transport?.close()
  transport = undefined
}

/** The development outbox page (/outbox) and its routes exist only when this is set. */
export function outboxPageEnabled(): boolean {
  return process.env.HOSEWRIGHT_MAIL_OUTBOX_PAGE === '1'
}
