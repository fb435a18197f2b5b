import { roleDescriptions, roleLabels } from '#shared/permissions'
import type { Role } from '#shared/schemas/membership'

// The wording of the e-mails Hosewright sends: plain text first (what most clients show and what
// the tests read), with a simple HTML version carrying the same words and link.

export interface MailContent { subject: string; text: string; html: string }

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' })[c]!)
}

/** "2026-05-01 14:00 UTC": unambiguous for a reader in any time zone. */
export function mailDate(date: Date): string {
  return `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`
}

function htmlOf(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map(p => `<p>${escapeHtml(p)}</p>`).join('\n')
  const button = `<p><a href="${escapeHtml(link.href)}" style="display:inline-block;padding:10px 18px;background:#9a4a1c;color:#fff;text-decoration:none;border-radius:6px;font-weight:bold">${escapeHtml(link.label)}</a></p>`
  const fallback = `<p style="font-size:13px;color:#555">Or open this address: ${escapeHtml(link.href)}</p>`
  return `<!doctype html><html><body style="font-family:sans-serif;font-size:16px;line-height:1.5;color:#222">\n${body}\n${button}\n${fallback}\n</body></html>`
}

export function invitationMail(input: {
  workshopName: string; role: Role; inviterName: string | null; inviteeName: string | null; link: string; expiresAt: Date
}): MailContent {
  const who = input.inviterName ? `${input.inviterName} invites you` : 'You are invited'
  const intro = `${who} to join ${input.workshopName} on Hosewright as ${roleLabels[input.role].toLowerCase()}: ${roleDescriptions[input.role].toLowerCase()}.`
  const expiry = `The link works once and until ${mailDate(input.expiresAt)}. If you did not expect this invitation, ignore this e-mail.`
  const greeting = input.inviteeName ? `Hello ${input.inviteeName},` : 'Hello,'
  return {
    subject: `Join ${input.workshopName} on Hosewright`,
    text: [greeting, '', intro, '', 'Accept the invitation:', input.link, '', expiry, ''].join('\n'),
    html: htmlOf([greeting, intro, expiry], { href: input.link, label: 'Accept the invitation' }),
  }
}

export function passwordResetMail(input: { name: string; email: string; link: string; minutes: number }): MailContent {
  const intro = `Someone asked to reset the password of the Hosewright account ${input.email}.`
  const expiry = `The link works once within ${input.minutes} minutes. If it was not you, ignore this e-mail: your password stays as it is.`
  const greeting = `Hello ${input.name},`
  return {
    subject: 'Reset your Hosewright password',
    text: [greeting, '', intro, '', 'Choose a new password:', input.link, '', expiry, ''].join('\n'),
    html: htmlOf([greeting, intro, expiry], { href: input.link, label: 'Choose a new password' }),
  }
}
