import { and, eq, isNull } from 'drizzle-orm'
import type { H3Event } from 'h3'
import type { Role } from '#shared/schemas/membership'
import type { InvitationClosedReason } from '#shared/schemas/invitation'
import type { InvitationRow } from '../database/schema'
import type { Database } from './db'
import { invitationMail } from '../mail/templates'

type Tx = Parameters<Parameters<Database['transaction']>[0]>[0]

const inviteDays = () => envNumber('HOSEWRIGHT_INVITE_DAYS', 7)

/** Gives the invitation a fresh token and expiry and queues the e-mail carrying its link. */
async function issueLink(tx: Tx, invitationId: string, senderId: string) {
  const { token, tokenHash } = createLinkToken()
  const expiresAt = new Date(Date.now() + inviteDays() * 86_400_000)
  const [invitation] = await tx.update(schema.invitations).set({ tokenHash, expiresAt })
    .where(eq(schema.invitations.id, invitationId)).returning()
  const [workshop] = await tx.select({ name: schema.workshops.name }).from(schema.workshops).where(eq(schema.workshops.id, invitation!.workshopId))
  const [sender] = await tx.select({ name: schema.users.name }).from(schema.users).where(eq(schema.users.id, senderId))
  const mail = invitationMail({
    workshopName: workshop!.name, role: invitation!.role, inviterName: sender?.name ?? null,
    inviteeName: invitation!.name, link: `${appUrl()}/invite/${token}`, expiresAt,
  })
  const mailId = await enqueueMail(tx, { workshopId: invitation!.workshopId, kind: 'invitation', to: invitation!.email, ...mail })
  const [updated] = await tx.update(schema.invitations).set({ mailId }).where(eq(schema.invitations.id, invitationId)).returning()
  return updated!
}

/** A new invitation (replacing any open one for the same address in this workshop), e-mail queued. */
export async function createInvitation(tx: Tx, input: { workshopId: string; email: string; name: string | null; role: Role; invitedBy: string }) {
  await tx.update(schema.invitations).set({ revokedAt: new Date() }).where(and(
    eq(schema.invitations.workshopId, input.workshopId), eq(schema.invitations.email, input.email),
    isNull(schema.invitations.acceptedAt), isNull(schema.invitations.revokedAt)))
  // issueLink replaces token and expiry in the same transaction; this hash matches no token
  const [row] = await tx.insert(schema.invitations).values({
    ...input, tokenHash: `unissued:${crypto.randomUUID()}`, expiresAt: new Date(),
  }).returning({ id: schema.invitations.id })
  return await issueLink(tx, row!.id, input.invitedBy)
}

/** Resend: a new link (the old one stops working) with a new expiry. */
export async function resendInvitation(tx: Tx, invitation: InvitationRow, senderId: string) {
  return await issueLink(tx, invitation.id, senderId)
}

export function invitationClosedReason(row: Pick<InvitationRow, 'acceptedAt' | 'revokedAt' | 'expiresAt'>): InvitationClosedReason | null {
  if (row.acceptedAt) return 'used'
  if (row.revokedAt) return 'revoked'
  if (row.expiresAt.getTime() <= Date.now()) return 'expired'
  return null
}

const closedMessages: Record<InvitationClosedReason, string> = {
  used: 'This invitation has already been used. Sign in to reach the workshop.',
  revoked: 'This invitation was withdrawn by the workshop. Ask them for a new one if you still need it.',
  expired: 'This invitation has expired. Ask the workshop to send you a new one.',
}

/** 410 with a plain message for a link that worked once but no longer does. */
export function invitationGone(reason: InvitationClosedReason): never {
  throw createError({ statusCode: 410, statusMessage: 'Invitation closed', message: closedMessages[reason], data: { reason } })
}

/** The invitation of a link token (with its workshop's name), or 404. */
export async function invitationByToken(executor: Database | Tx, token: string, lock = false) {
  const query = executor.select({ invitation: schema.invitations, workshopName: schema.workshops.name })
    .from(schema.invitations)
    .innerJoin(schema.workshops, eq(schema.workshops.id, schema.invitations.workshopId))
    .where(eq(schema.invitations.tokenHash, hashLinkToken(token)))
  const [found] = lock ? await query.for('update', { of: schema.invitations }) : await query
  if (!found) notFound('This invitation link is not valid. Check that the whole address from the e-mail was opened.')
  return found
}

/** The signed-in user, or null when signed out (a public page may be opened either way). */
export async function signedInUserOrNull(event: H3Event) {
  return await requireUser(event).catch((error: { statusCode?: number }) => {
    if (error.statusCode === 401) return null
    throw error
  })
}
