// The review's e-mails, queued in the transaction of the action that causes them.
import { and, eq, inArray, ne } from 'drizzle-orm'
import type { ReviewRow } from '../database/schema'
import type { Database } from './db'

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

interface CircuitRef { id: string; title: string; projectTitle: string }
interface Person { id: string; name: string }

const escapeMailHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;')

/** Plain text and a simple HTML twin from the same paragraphs; a quoted note keeps its line breaks. */
export function reviewMailBody(greeting: string, paragraphs: string[], quote: { who: string; text: string } | null, link: { label: string; url: string }) {
  const text = [greeting, '', ...paragraphs.flatMap((p) => [p, ''])]
  if (quote?.text.trim()) text.push(`${quote.who}:`, ...quote.text.trim().split('\n').map((l) => `  > ${l}`), '')
  text.push(`${link.label}: ${link.url}`, '', '— Hosewright')
  const html = [
    `<p>${escapeMailHtml(greeting)}</p>`,
    ...paragraphs.map((p) => `<p>${escapeMailHtml(p)}</p>`),
    quote?.text.trim() ? `<p>${escapeMailHtml(quote.who)}:</p><blockquote style="border-left:3px solid #b87333;margin:0;padding:0 0 0 12px;white-space:pre-line">${escapeMailHtml(quote.text.trim())}</blockquote>` : '',
    `<p><a href="${escapeMailHtml(link.url)}">${escapeMailHtml(link.label)}</a></p>`,
    '<p style="color:#6b6358">— Hosewright</p>',
  ].join('\n')
  return { text: text.join('\n'), html }
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`

/** 'review-requested' to every reviewer and owner of the workshop except the submitter. */
export async function queueReviewRequested(tx: Tx, review: ReviewRow, circuit: CircuitRef, submitter: Person) {
  const recipients = await tx.select({ email: schema.users.email, name: schema.users.name }).from(schema.memberships)
    .innerJoin(schema.users, eq(schema.users.id, schema.memberships.userId))
    .where(and(eq(schema.memberships.workshopId, review.workshopId), inArray(schema.memberships.role, ['reviewer', 'owner']), ne(schema.users.id, submitter.id)))
  const s = review.summary
  for (const r of recipients) {
    const body = reviewMailBody(`Hello ${r.name},`, [
      `${submitter.name} has put version ${review.version} of “${circuit.title}” (project “${circuit.projectTitle}”) up for review before the first fill.`,
      `The check finds ${plural(s.error, 'error')}, ${plural(s.warning, 'warning')} and ${plural(s.note, 'note')} on this version. Errors must be fixed before it can be approved; each warning needs a reason to accept it.`,
    ], { who: `${submitter.name} wrote`, text: review.submitNote }, { label: 'Open the review', url: `${appUrl()}/reviews/${review.id}` })
    await enqueueMail(tx, { workshopId: review.workshopId, kind: 'review-requested', to: r.email, subject: `Review wanted: ${circuit.title}, version ${review.version}`, ...body })
  }
}

/** 'review-approved' or 'changes-requested' to the submitter, with the reviewer's note. */
export async function queueReviewDecided(tx: Tx, review: ReviewRow, circuit: CircuitRef, decider: Person) {
  if (!review.submittedBy || review.submittedBy === decider.id) return
  const [to] = await tx.select({ email: schema.users.email, name: schema.users.name }).from(schema.users).where(eq(schema.users.id, review.submittedBy))
  if (!to) return
  const approved = review.state === 'approved'
  const body = reviewMailBody(`Hello ${to.name},`, approved
    ? [`${decider.name} has approved version ${review.version} of “${circuit.title}” (project “${circuit.projectTitle}”). The technicians now see this version first; later saves stay drafts until they are reviewed again.`,
      'The build sheet of this version is attached as a PDF.']
    : [`${decider.name} has asked for changes to version ${review.version} of “${circuit.title}” (project “${circuit.projectTitle}”). Make them, save, and put the new version up for review.`],
  { who: `${decider.name} wrote`, text: review.decisionNote }, { label: approved ? 'See the approved version' : 'See the review', url: `${appUrl()}/reviews/${review.id}` })
  await enqueueMail(tx, {
    workshopId: review.workshopId, kind: approved ? 'review-approved' : 'changes-requested', to: to.email,
    subject: approved ? `Approved: ${circuit.title}, version ${review.version}` : `Changes wanted: ${circuit.title}, version ${review.version}`,
    ...body,
    // the build sheet of the approved version, made at send time (server/plugins/buildSheetAttachment.ts)
    attachments: approved ? [{ kind: 'build-sheet', ref: `${circuit.id}:${review.version}`, filename: `build-sheet-v${review.version}.pdf` }] : [],
  })
}
